import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import fontkit from '@pdf-lib/fontkit';

// Roboto as full TrueType files: the standard PDF fonts cannot draw Ω, α, ≤ or most accented names,
// and the web font files are split by script.
const require = createRequire(import.meta.url);
const load = (file: string) => readFileSync(require.resolve(`@expo-google-fonts/roboto/${file}`));

let cached: { regular: Uint8Array; bold: Uint8Array; covers: (cp: number) => boolean } | null = null;

export function robotoFiles() {
  if (!cached) {
    const regular = load('400Regular/Roboto_400Regular.ttf');
    const bold = load('700Bold/Roboto_700Bold.ttf');
    const face = fontkit.create(regular) as unknown as { hasGlyphForCodePoint(cp: number): boolean };
    cached = { regular, bold, covers: (cp) => face.hasGlyphForCodePoint(cp) };
  }
  return cached;
}

export { fontkit };
