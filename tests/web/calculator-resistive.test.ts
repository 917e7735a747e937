import { afterEach, describe, expect, it, vi } from 'vitest';
import CalculatorResistivePanel from '@/components/CalculatorResistivePanel.vue';
import { fakeFetch, getByRole, messagesBeside, mountWith, nameOf, settle, type, userWith } from './support';

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

const numberBox = (label: string) => [...document.querySelectorAll<HTMLInputElement>('input[type="number"]')].find((el) => nameOf(el) === label)!;
const rowValue = (label: string) =>
  [...document.querySelectorAll('tbody tr')].find((tr) => tr.querySelector('th')?.textContent?.trim() === label)?.querySelector('td')?.textContent?.replace(/\s+/g, ' ').trim();

describe('the resistive load calculator', () => {
  // Rashid, Power Electronics: Devices, Circuits, and Applications, 4th ed., Example 11.1: 120 V, 60 Hz, 10 Ω, α = 90°.
  it('when Rashid 4th ed. Example 11.1 is entered, then the table shows 84.85 V and a power factor of 0.707', async () => {
    fakeFetch(() => undefined);
    await mountWith(CalculatorResistivePanel, { user: userWith(['technician']), props: { supply: { voltageRms: 120, frequencyHz: 60 } } });
    await type(numberBox('Load resistance'), '10');
    expect(rowValue('Output voltage (RMS)')).toBe('84.9 V'); // Rashid 4th ed. Ex. 11.1: 84.85 V (shown to one decimal)
    expect(rowValue('Input power factor')).toBe('0.707'); // Rashid 4th ed. Ex. 11.1: PF 0.707
    expect(getByRole('img', /^Resistive load/).getAttribute('aria-label')).toContain('fires 90.0° after each zero crossing');
  });

  it('when the wanted power is more than the load can take, then the message beside it says what can be delivered', async () => {
    fakeFetch(() => undefined);
    await mountWith(CalculatorResistivePanel, { user: userWith(['technician']), props: { supply: { voltageRms: 230, frequencyHz: 50 } } });
    await type(numberBox('Wanted power'), '2000');
    expect(messagesBeside(numberBox('Wanted power'))).toMatch(/outside what phase control can deliver: 0 to 1000\.000 W/);
  });

  it('when a reachable power is wanted and its angle is taken, then the slider and the table move to it (half power at 90°, common practice)', async () => {
    fakeFetch(() => undefined);
    await mountWith(CalculatorResistivePanel, { user: userWith(['technician']), props: { supply: { voltageRms: 230, frequencyHz: 50 } } });
    const slider = getByRole('slider', 'Firing angle');
    slider.dispatchEvent(new KeyboardEvent('keydown', { key: 'Home', bubbles: true }));
    await settle();
    expect(rowValue('Fraction of full power')).toBe('100.0 %');
    await type(numberBox('Wanted power'), '500');
    getByRole('button', 'Use this angle').click();
    await settle();
    expect(slider.getAttribute('aria-valuenow')).toBe('90');
    expect(rowValue('Fraction of full power')).toBe('50.0 %');
  });
});
