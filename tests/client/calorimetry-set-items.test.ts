import { describe, expect, it } from 'vitest';
import { setItemInputSchema } from '@shared/schemas/reaction-sets';
import { bombRow, bombRunInput, emptyBombRow } from '@/lib/bomb-form';
import { calorimetryQuery, calorimetryRunItem, itemOpenLink, itemOpenPage } from '@/lib/set-items';

const neutralisation = {
  solution: { mass: { value: 200, unit: 'g' as const } },
  temperature: { initial: { value: 22.5, unit: 'C' as const }, final: { value: 25.86, unit: 'C' as const } },
  reaction: {
    equation: 'HCl(aq) + NaOH(aq) -> NaCl(aq) + H2O(l)',
    limiting: { term: 0, amount: { value: 0.05, unit: 'mol' as const } },
  },
};

describe('calorimetryRunItem', () => {
  it('keeps inputs, readings file, label and the team run, never a result, and passes the shared schema', () => {
    const item = calorimetryRunItem(
      {
        kind: 'constant-pressure',
        inputs: neutralisation,
        evidence: { fileName: 'run1.csv', text: '0,22.5\n' },
        label: '  Run 1 ',
      },
      '11111111-1111-4111-8111-111111111111',
    );
    expect(item).toEqual({
      kind: 'calorimetry-run',
      runKind: 'constant-pressure',
      label: 'Run 1',
      inputs: neutralisation,
      evidence: { fileName: 'run1.csv', text: '0,22.5\n' },
      fromRun: '11111111-1111-4111-8111-111111111111',
    });
    expect(setItemInputSchema.safeParse(item).success).toBe(true);
  });

  it('leaves an empty label out and records no team run when the run was not saved', () => {
    const item = calorimetryRunItem({ kind: 'constant-pressure', inputs: neutralisation, label: ' ' });
    expect(item).not.toHaveProperty('label');
    expect(item).toMatchObject({ fromRun: null, evidence: null });
  });
});

describe('itemOpenLink for a calorimetry run, and calorimetryQuery', () => {
  const item = { ...calorimetryRunItem({ kind: 'constant-pressure', inputs: neutralisation }), id: 'run-1' };

  it('opens /calorimetry with the set and item ids, which the page reads back', () => {
    const link = itemOpenLink(item, { teamId: 't1', setId: 's1' }) as { name: string; query: Record<string, string> };
    expect(link).toEqual({ name: 'calorimetry', query: { team: 't1', set: 's1', item: 'run-1' } });
    expect(calorimetryQuery(link.query)).toEqual({ teamId: 't1', setId: 's1', itemId: 'run-1' });
    expect(itemOpenPage(item)).toBe('calorimetry');
  });

  it('gives no link without the set, and reads no query with a part missing', () => {
    expect(itemOpenLink(item)).toBeNull();
    expect(calorimetryQuery({ team: 't1', set: 's1' })).toBeNull();
    expect(calorimetryQuery({ team: ['t1'], set: 's1', item: 'x' })).toBeNull();
  });
});

describe('bombRunInput and bombRow', () => {
  it('sends the titration instead of a typed nitric-acid energy, with every uncertainty, and buoyancy', () => {
    const row = {
      ...emptyBombRow(),
      mass: 1.0,
      massU: 0.00002,
      rise: 2.65,
      riseU: 0.0003,
      fuse: 50,
      fuseU: 2,
      nitricAcid: 40,
      titrantVolume: 6.1,
      titrantVolumeU: 0.02,
      titrantConcentration: 0.1,
      titrantConcentrationU: 0.0005,
      sampleDensity: 1.32,
    };
    expect(bombRunInput(row)).toEqual({
      mass: { value: 1.0, unit: 'g', uncertainty: 0.00002 },
      buoyancy: { sampleDensity: 1.32 },
      temperature: { rise: { value: 2.65, unit: 'K', uncertainty: 0.0003 } },
      fuse: { energy: { value: 50, unit: 'J', uncertainty: 2 } },
      nitricAcid: {
        titrantVolume: { value: 6.1, unit: 'mL', uncertainty: 0.02 },
        titrantConcentration: { value: 0.1, unit: 'mol/L', uncertainty: 0.0005 },
      },
    });
  });

  it('sends a readings series in place of the rise', () => {
    const series: [number, number][] = [
      [0, 25],
      [60, 25.01],
      [120, 27.6],
      [180, 27.61],
    ];
    const input = bombRunInput({
      ...emptyBombRow(),
      mass: 1,
      readings: { series, unit: 'C', mixingTime: 60, method: 'regnault-pfaundler', evidence: null },
    });
    expect(input.temperature).toEqual({ series, unit: 'C', mixingTime: 60, method: 'regnault-pfaundler' });
  });

  it('fills a row back in the form units (mg → g, kJ and cal → J, °F degrees → K) and names what it cannot show', () => {
    const { row, unshown } = bombRow({
      mass: { value: 1000, unit: 'mg', uncertainty: 0.02 },
      temperature: { rise: { value: 4.5, unit: 'F', uncertainty: 0.009 } },
      fuse: { length: { value: 10, unit: 'cm' }, energyPerLength: { value: 9.6, unit: 'J/cm' } },
      nitricAcid: { energy: { value: 10, unit: 'cal' } },
      ignition: { value: 1, unit: 'J' },
    });
    expect(row.mass).toBeCloseTo(1, 12);
    expect(row.massU).toBeCloseTo(0.00002, 12);
    // A Fahrenheit degree is 5/9 of a kelvin (definition of the scale).
    expect(row.rise).toBeCloseTo(2.5, 12);
    expect(row.riseU).toBeCloseTo(0.005, 12);
    // 1 thermochemical calorie = 4.184 J exactly.
    expect(row.nitricAcid).toBeCloseTo(41.84, 12);
    expect(row.fuse).toBeNull();
    expect(unshown).toEqual(['a fuse given by its length', 'an ignition energy']);
  });

  it('round-trips a run the form can show', () => {
    const run = {
      mass: { value: 0.9, unit: 'g' as const, uncertainty: 0.00001 },
      buoyancy: { sampleDensity: 1.32 },
      temperature: { rise: { value: 2.4, unit: 'K' as const, uncertainty: 0.0002 } },
      fuse: { energy: { value: 45, unit: 'J' as const, uncertainty: 1 } },
      nitricAcid: { energy: { value: 38, unit: 'J' as const, uncertainty: 3 } },
    };
    expect(bombRunInput(bombRow(run).row)).toEqual(run);
  });
});
