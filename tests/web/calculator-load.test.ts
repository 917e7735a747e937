import { afterEach, describe, expect, it, vi } from 'vitest';
import CalculatorLoadPanel from '@/components/CalculatorLoadPanel.vue';
import { fakeFetch, mountWith, nameOf, settle, userWith } from './support';

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

const supply = { voltageRms: 120, frequencyHz: 60 };
const radio = (label: string) => [...document.querySelectorAll<HTMLInputElement>('input[type="radio"]')].find((el) => nameOf(el) === label)!;
const note = () => document.querySelector('[data-testid="load-model-note"]')?.textContent ?? '';
const rowValue = (label: string) =>
  [...document.querySelectorAll('tbody tr')].find((tr) => tr.querySelector('th')?.textContent?.includes(label))?.querySelector('td')?.textContent?.trim();

async function choose(label: string) {
  radio(label).click();
  await settle();
}

describe('the load calculator', () => {
  // Hart, Power Electronics, 1st ed., Example 6-3 (from memory): 120 V, 60 Hz, 20 Ω, 50 mH, α = 90° → β ≈ 220°.
  it('when an R-L load is shown, then the extinction angle of Hart 1st ed. Ex. 6-3 appears (from memory)', async () => {
    fakeFetch(() => undefined);
    await mountWith(CalculatorLoadPanel, { user: userWith(['assessor']), props: { supply } });
    expect(Math.abs(Number(rowValue('extinction angle')?.replace(/[^\d.]/g, '')) - 220)).toBeLessThan(1);
    expect(note()).toBe('');
  });

  it('when a universal motor is chosen, then the page says it is not modelled and shows no figures', async () => {
    fakeFetch(() => undefined);
    await mountWith(CalculatorLoadPanel, { user: userWith(['technician']), props: { supply } });
    await choose('Universal motor');
    expect(note()).toMatch(/not modelled/);
    expect(note()).toMatch(/back-EMF/);
    expect(document.querySelectorAll('tbody tr')).toHaveLength(0);
  });

  it('when a lamp filament is chosen, then its figures are marked as estimates, with the cold switch-on current', async () => {
    fakeFetch(() => undefined);
    await mountWith(CalculatorLoadPanel, { user: userWith(['technician']), props: { supply } });
    await choose('Lamp filament (hot resistance)');
    expect(note()).toMatch(/estimate/);
    const rows = [...document.querySelectorAll('tbody tr')];
    expect(rows.length).toBeGreaterThan(0);
    expect(rows.every((tr) => tr.querySelector('.v-chip')?.textContent?.trim() === 'estimate')).toBe(true);
    expect(rowValue('Switch-on peak from cold')).toMatch(/A$/);
  });
});
