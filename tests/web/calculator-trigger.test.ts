import { afterEach, describe, expect, it, vi } from 'vitest';
import CalculatorTriggerPanel from '@/components/CalculatorTriggerPanel.vue';
import { fakeFetch, getByRole, mountWith, nameOf, settle, type, userWith } from './support';

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

const supply = { voltageRms: 230, frequencyHz: 50 };
const readout = () => document.querySelector('[data-testid="trigger-readout"]')!.textContent!.trim();
const angleIn = (text: string) => Number(/Firing angle ([\d.]+)°/.exec(text)?.[1]);
const outputPath = () => document.querySelector('[data-series="output"]')!.getAttribute('d');
const plotLabel = () => getByRole('img', /^Trigger network, simulated/).getAttribute('aria-label')!;
/** A number box by its label (the support helpers know text boxes only). */
const numberBox = (label: string) => [...document.querySelectorAll<HTMLInputElement>('input[type="number"]')].find((el) => nameOf(el) === label)!;

async function press(el: HTMLElement, key: string, times = 1) {
  for (let i = 0; i < times; i++) {
    el.dispatchEvent(new KeyboardEvent('keydown', { key, bubbles: true }));
    await settle(); // each key moves on from the value the last one left
  }
}

describe('the trigger network calculator', () => {
  it('when the potentiometer slider moves up, then the firing angle rises and the plot’s output path changes', async () => {
    const calls = fakeFetch(() => undefined);
    await mountWith(CalculatorTriggerPanel, { user: userWith(['technician']), props: { supply } });
    const slider = getByRole('slider', 'Potentiometer setting');
    expect(slider.getAttribute('aria-valuenow')).toBe('30');
    const before = { angle: angleIn(readout()), path: outputPath(), label: plotLabel() };
    expect(before.angle).toBeGreaterThan(0);
    expect(before.label).toContain(`fires ${before.angle.toFixed(1)}° after each zero crossing`);

    await press(slider, 'ArrowRight', 10);
    expect(slider.getAttribute('aria-valuenow')).toBe('40');
    const after = angleIn(readout());
    // More series resistance delays the capacitor, so the triac fires later (the engine's simulation, computed in the browser).
    expect(after).toBeGreaterThan(before.angle);
    expect(outputPath()).not.toBe(before.path);
    expect(plotLabel()).toContain(`fires ${after.toFixed(1)}°`);
    expect(calls).toHaveLength(0); // a live preview: nothing was sent to the server
  });

  it('when the slider is pushed to the end of a 470 kΩ track, then the page says it does not fire', async () => {
    fakeFetch(() => undefined);
    await mountWith(CalculatorTriggerPanel, { user: userWith(['technician']), props: { supply } });
    await press(getByRole('slider', 'Potentiometer setting'), 'End');
    expect(readout()).toMatch(/Does not fire/);
    expect(plotLabel()).toContain('does not fire');
  });

  it('when the breakback is set above the breakover, then the message shows beside the breakback field', async () => {
    fakeFetch(() => undefined);
    await mountWith(CalculatorTriggerPanel, { user: userWith(['technician']), props: { supply } });
    const field = numberBox('Diac breakback voltage');
    await type(field, '40');
    expect(field.closest('.v-input')?.querySelector('.v-messages')?.textContent).toContain('Breakback must be smaller than the breakover voltage');
    expect(readout()).toMatch(/Fill in the values/);
  });
});
