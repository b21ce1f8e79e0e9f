// @vitest-environment happy-dom
import { mount } from '@vue/test-utils';
import { describe, expect, it } from 'vitest';
import EquationField from '@/components/equations/EquationField.vue';
import { readEquation } from '@/lib/read-equation';

/** The problem the field shows for a text, from the shared parser (as the workbench gets it). */
function problemOf(text: string) {
  const reading = readEquation(text);
  if (reading.kind !== 'error') throw new Error(`expected a parse problem for ${text}`);
  return reading.problem;
}

describe('EquationField', () => {
  it('marks the faulty text at the column the core names, and says what is wrong', () => {
    const text = 'H2 + Xx2 -> H2O';
    const wrapper = mount(EquationField, { props: { modelValue: text, problem: problemOf(text) } });
    expect(wrapper.get('[data-testid="parse-error-span"]').text()).toBe('Xx');
    expect(wrapper.get('[data-testid="parse-error-marker"]').text()).toBe(text);
    expect(wrapper.get('[data-testid="parse-error"]').attributes('role')).toBe('alert');
    expect(wrapper.get('[data-testid="parse-error"]').text()).toContain("Unknown element symbol 'Xx' at column 6");
  });

  it('marks a blank after the end when something is missing', () => {
    const text = 'H2 + O2';
    const wrapper = mount(EquationField, { props: { modelValue: text, problem: problemOf(text) } });
    const mark = wrapper.get('[data-testid="parse-error-span"]');
    expect(mark.classes()).toContain('at-end');
    expect(wrapper.get('[data-testid="parse-error"]').text()).toMatch(/without an arrow/);
  });

  it('marks the whole fractional multiplier a zero denominator spoils', () => {
    const text = 'CaSO4·1/0H2O -> CaSO4';
    const wrapper = mount(EquationField, { props: { modelValue: text, problem: problemOf(text) } });
    expect(wrapper.get('[data-testid="parse-error-span"]').text()).toBe('1/0');
  });

  it('shows the notation hint when the text reads, and reports typing', async () => {
    const wrapper = mount(EquationField, { props: { modelValue: 'H2 + O2 -> H2O', problem: null } });
    expect(wrapper.find('[data-testid="parse-error"]').exists()).toBe(false);
    expect(wrapper.text()).toContain('Phases in brackets');
    await wrapper.get('input').setValue('N2 + H2 -> NH3');
    expect(wrapper.emitted('update:modelValue')?.at(-1)).toEqual(['N2 + H2 -> NH3']);
  });

  it('ties the input to its label and to the feedback read out to screen readers', () => {
    const wrapper = mount(EquationField, { props: { modelValue: '', problem: null } });
    expect(wrapper.get('label').attributes('for')).toBe('equation-input');
    expect(wrapper.get('input').attributes('aria-describedby')).toBe('equation-input-feedback');
    expect(wrapper.get('#equation-input-feedback').attributes('aria-live')).toBe('polite');
  });

  it('takes its ids from inputId, so two fields on one page stay apart', () => {
    const wrapper = mount(EquationField, {
      props: { modelValue: '', problem: null, inputId: 'target-input', label: 'Target' },
    });
    expect(wrapper.get('label').attributes('for')).toBe('target-input');
    expect(wrapper.get('label').text()).toBe('Target');
    expect(wrapper.get('input').attributes('aria-describedby')).toBe('target-input-feedback');
    expect(wrapper.find('#target-input-feedback').exists()).toBe(true);
  });
});
