// @vitest-environment happy-dom
import { mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { beforeEach, describe, expect, it } from 'vitest';
import SpeciesEntryForm from '@/components/curation/SpeciesEntryForm.vue';
import ImportReportTable from '@/components/curation/ImportReportTable.vue';
import ImportProgress from '@/components/curation/ImportProgress.vue';

beforeEach(() => setActivePinia(createPinia()));

describe('SpeciesEntryForm', () => {
  it('shows the messages under its own fields and adds nothing while the key and name are empty', async () => {
    const wrapper = mount(SpeciesEntryForm);
    await wrapper.get('[data-testid="entry-add"]').trigger('click');
    expect(wrapper.emitted('add')).toBeUndefined();
    const key = wrapper.get('[data-testid="entry-species-key"] input');
    expect(key.attributes('aria-invalid')).toBe('true');
    expect(wrapper.get(`[id="${key.attributes('aria-describedby')}"]`).text()).not.toBe('');
  });

  it('emits one set-species entry and clears the form', async () => {
    const wrapper = mount(SpeciesEntryForm);
    await wrapper.get('[data-testid="entry-species-key"] input').setValue('C9H10O2(l, benzyl acetate)');
    await wrapper.get('[data-testid="entry-species-name"] input').setValue('benzyl acetate');
    await wrapper.get('[data-testid="entry-add"]').trigger('click');
    expect(wrapper.emitted('add')).toEqual([
      [{ kind: 'set-species', key: 'C9H10O2(l, benzyl acetate)', name: 'benzyl acetate' }],
    ]);
    expect((wrapper.get('[data-testid="entry-species-key"] input').element as HTMLInputElement).value).toBe('');
  });
});

describe('ImportReportTable', () => {
  const problems = Array.from({ length: 30 }, (_, i) => ({
    file: 'values.csv',
    line: i + 2,
    column: 'value',
    reason: `"x${i}" is not a number.`,
  }));

  it('lists the bad rows with line, column, reason and file, 25 to a page when there are more', () => {
    const wrapper = mount(ImportReportTable, { props: { problems } });
    const rows = wrapper.findAll('[data-testid="import-problem"]');
    expect(rows).toHaveLength(25);
    expect(rows[0]!.findAll('td').map((td) => td.text())).toEqual(['2', 'value', '"x0" is not a number.']);
    expect(wrapper.get('[data-testid="import-report-summary"]').text()).toBe(
      '30 problems in 30 rows of 1 file. File: values.csv.',
    );
  });

  it('shows every row on one page when there are few, with a file column when the rows come from several files', () => {
    const two = [...problems.slice(0, 2), { file: 'species.csv', line: 4, column: 'key', reason: 'Does not parse.' }];
    const wrapper = mount(ImportReportTable, { props: { problems: two } });
    const rows = wrapper.findAll('[data-testid="import-problem"]');
    expect(rows).toHaveLength(3);
    expect(rows[0]!.findAll('td').map((td) => td.text())).toEqual(['4', 'key', 'Does not parse.', 'species.csv']);
  });
});

describe('ImportProgress', () => {
  it('shows the phase and the rows read of a running job', () => {
    const wrapper = mount(ImportProgress, {
      props: {
        job: {
          jobId: '00000000-0000-4000-8000-000000000001',
          state: 'running',
          rowsRead: 2_500,
          rowsTotal: 10_000,
          report: null,
          amendmentId: null,
          error: null,
        },
      },
    });
    expect(wrapper.get('[data-testid="import-progress"]').attributes('data-phase')).toBe('reading');
    expect(wrapper.get('[data-testid="import-count"]').text()).toBe('2,500 of 10,000 rows read');
    expect(wrapper.get('[role="progressbar"]').attributes('aria-valuenow')).toBe('25');
  });
});
