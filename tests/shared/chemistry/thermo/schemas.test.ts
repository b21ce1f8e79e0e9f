import { describe, expect, it } from 'vitest';
import { speciesThermoModelSchema, statedUncertaintySchema, thermoModelRecordSchema } from '@shared/schemas/thermo';
import { enthalpyIncrement } from '@shared/chemistry/thermo';
import { entry, nasaEntries } from './nasa-fixture';

const kohLine = () => ({
  species: 'KOH(cr)',
  source: 'nasa-tm4513',
  entryNote: 'J12/70',
  provenance: 'entered',
  scale: 'formation',
  forms: [
    {
      form: 'α',
      label: 'KOH(a)',
      model: { kind: 'nasa7', ranges: entry('KOH(a)').ranges, coefficients: entry('KOH(a)').coefficients },
    },
    {
      form: 'β',
      label: 'KOH(b)',
      model: { kind: 'nasa7', ranges: entry('KOH(b)').ranges, coefficients: entry('KOH(b)').coefficients },
    },
  ],
});

describe('thermoModelRecordSchema (seeds/library/FORMAT.md models-*.jsonl)', () => {
  it('accepts every fixture entry as a one-form line, and the parsed value evaluates', () => {
    for (const e of Object.values(nasaEntries)) {
      const line = {
        species: 'X(g)',
        source: 'nasa-tm4513',
        entryNote: e.note,
        provenance: 'entered',
        scale: 'formation',
        forms: [
          {
            form: null,
            label: e.name,
            model: { kind: e.model === 'NASA7' ? 'nasa7' : 'nasa9', ranges: e.ranges, coefficients: e.coefficients },
          },
        ],
      };
      expect(thermoModelRecordSchema.safeParse(line).success).toBe(true);
    }
    const parsed = thermoModelRecordSchema.parse(kohLine());
    expect(enthalpyIncrement(parsed, 600)).toBeGreaterThan(20);
  });

  it('accepts relative-scale models with stated transitions, Cp tables and constants', () => {
    const line = {
      species: 'Y(cr)',
      source: 'x',
      provenance: 'memory',
      scale: 'relative',
      forms: [
        {
          form: 'I',
          label: 'I',
          model: {
            kind: 'cp-table',
            points: [
              [250, 40],
              [400, 45],
            ],
          },
        },
        {
          form: 'II',
          label: 'II',
          model: { kind: 'constant', cp: 50, range: [400, 600] },
          transition: { temperature: 400, enthalpy: 2.5 },
        },
        {
          form: null,
          label: 'liquid',
          model: { kind: 'shomate', ranges: [600, 900], coefficients: [[1, 2, 3, 4, 5, 6, 7, 8]] },
          transition: { temperature: 600, enthalpy: 9 },
        },
      ],
    };
    expect(thermoModelRecordSchema.safeParse(line).success).toBe(true);
  });

  const issuesOf = (value: unknown) => {
    const r = thermoModelRecordSchema.safeParse(value);
    return r.success ? [] : r.error.issues.map((i) => [i.path.join('.'), i.message]);
  };

  it('names the field of each problem', () => {
    const wrongCount = kohLine();
    wrongCount.forms[0]!.model.coefficients = [[1, 2, 3]];
    expect(issuesOf(wrongCount)[0]![0]).toBe('forms.0.model.coefficients.0');

    const gap = kohLine();
    gap.forms[1]!.model.ranges = [520, 679];
    expect(issuesOf(gap)).toContainEqual([
      'forms.1.model',
      'form starts at 520 K but the form before it ends at 516 K',
    ]);

    const decreasing = kohLine();
    decreasing.forms[1]!.model.ranges = [516, 400];
    expect(issuesOf(decreasing).map((i) => i[0])).toContain('forms.1.model.ranges.1');

    const tableOnFormation = {
      ...kohLine(),
      forms: [
        {
          form: null,
          label: 't',
          model: {
            kind: 'cp-table',
            points: [
              [300, 10],
              [400, 12],
            ],
          },
        },
      ],
    };
    expect(issuesOf(tableOnFormation).map((i) => i[0])).toContain('forms.0.model.kind');

    const noTransition = {
      species: 'Y',
      source: 's',
      provenance: 'entered',
      scale: 'relative',
      forms: [
        { form: 'a', label: 'a', model: { kind: 'constant', cp: 1, range: [300, 400] } },
        { form: 'b', label: 'b', model: { kind: 'constant', cp: 1, range: [400, 500] } },
      ],
    };
    expect(issuesOf(noTransition).map((i) => i[0])).toContain('forms.1.transition');

    expect(issuesOf({ ...kohLine(), provenance: 'guess' }).map((i) => i[0])).toContain('provenance');
    expect(issuesOf({ ...kohLine(), extra: 1 }).length).toBeGreaterThan(0);
  });

  it('speciesThermoModelSchema takes the model without source fields', () => {
    const { source: _s, entryNote: _e, provenance: _p, ...model } = kohLine();
    expect(speciesThermoModelSchema.safeParse(model).success).toBe(true);
  });
});

describe('statedUncertaintySchema', () => {
  it('accepts the FORMAT.md kinds and refuses an expanded value without k', () => {
    for (const v of [
      { kind: 'standard', value: 0.1 },
      { kind: 'expanded', value: 0.2, k: 2 },
      { kind: 'two-sigma', value: 0.2 },
      { kind: 'interval', value: 0.13 },
      { kind: 'none' },
    ])
      expect(statedUncertaintySchema.safeParse(v).success).toBe(true);
    expect(statedUncertaintySchema.safeParse({ kind: 'expanded', value: 0.2 }).success).toBe(false);
    expect(statedUncertaintySchema.safeParse({ kind: 'standard', value: -0.2 }).success).toBe(false);
  });
});
