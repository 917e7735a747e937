import { computed } from 'vue';
import type { z, ZodType } from 'zod';
import { EngineError } from '@shared/engine/errors';

export interface Calculation<O> {
  result: O | null;
  /** Messages by field path ("supply.voltageRms"), from the same schema and engine the server uses. */
  fields: Record<string, string>;
}

/** The supply chosen at the top of the calculator; empty boxes are null until filled in. */
export interface SupplyState {
  voltageRms: number | null;
  frequencyHz: number | null;
}

/** How a figure was obtained, shown beside it. */
export type FigureTag = 'estimate' | 'not modelled' | 'simulated';

export interface ResultRow {
  label: string;
  value: string;
  unit?: string;
  tag?: FigureTag;
}

/**
 * A live preview: the input is checked with the server's own schema, then computed in the browser by the
 * shared engine. Nothing is stored from here; the server stays the authority for expected values.
 */
export function useCalculation<S extends ZodType, O>(schema: S, input: () => unknown, calculate: (parsed: z.output<S>) => O) {
  const calculation = computed<Calculation<O>>(() => {
    const parsed = schema.safeParse(input());
    if (!parsed.success) {
      const fields: Record<string, string> = {};
      for (const issue of parsed.error.issues) fields[issue.path.map(String).join('.')] ??= issue.message;
      return { result: null, fields };
    }
    try {
      return { result: calculate(parsed.data), fields: {} };
    } catch (e) {
      if (e instanceof EngineError) return { result: null, fields: { [e.field]: e.message } };
      throw e;
    }
  });
  const result = computed(() => calculation.value.result);
  /** Vuetify `error-messages` for one field. */
  const messagesFor = (field: string): string[] => {
    const m = calculation.value.fields[field];
    return m ? [m] : [];
  };
  /** Problems with fields this form does not show (the supply, above the tabs), in words. */
  const otherProblems = (shown: readonly string[]) =>
    Object.entries(calculation.value.fields)
      .filter(([field]) => !shown.includes(field))
      .map(([field, message]) => `${field}: ${message}`);
  return { calculation, result, messagesFor, otherProblems };
}

/** A figure for the table: fixed decimals, and a dash where the engine has none. */
export function fmt(x: number | null | undefined, decimals = 2): string {
  return x === null || x === undefined || !Number.isFinite(x) ? '—' : x.toFixed(decimals);
}

/** Scales a form value in display units (kΩ, nF, mA) to SI, keeping an empty field empty so the schema names it. */
export const scaled = (x: number | null, factor: number): number | null => (x === null ? null : x * factor);
