import { describe, expect, it } from 'vitest';
import { parseCheckCaseCsv } from '@/lib/client/check-case-csv';

const def = {
  inputs: [{ symbol: 'T', name: 'temperature', unit: 'K' }, { symbol: 'Pr', name: 'Prandtl number', unit: '1' }],
  outputs: [{ symbol: 'mu', name: 'viscosity', unit: 'Pa s', expression: 'T' }],
};

describe('check cases from CSV', () => {
  it('reads units in headers, tolerances, sources and expected warnings', () => {
    const csv = 'label,T [degC],Pr,expected:mu,rel,why,source_kind,citation,locator,expect_warnings\n'
      + 'sea level,15,0.71,1.7894e-5,1e-3,table rounding,published,U.S. Standard Atmosphere 1976,Table I,\n'
      + 'too cold,-200,0.71,,,outside,common-practice,validity range,,T\n';
    const { rows, fileErrors } = parseCheckCaseCsv(csv, def);
    expect(fileErrors).toEqual([]);
    expect(rows[0].errors).toEqual([]);
    expect(rows[0].checkCase).toEqual({
      label: 'sea level', inputs: { T: { value: 15, unit: 'degC' }, Pr: 0.71 }, expected: { mu: 1.7894e-5 },
      tolerance: { rel: 1e-3, why: 'table rounding' }, source: { kind: 'published', citation: 'U.S. Standard Atmosphere 1976', locator: 'Table I' },
    });
    expect(rows[1].errors).toEqual(['tolerance: a tolerance needs rel (relative), abs (absolute), or both']);
  });

  it('names each bad row and field, and keeps nothing from it', () => {
    const csv = 'label,T,Pr,expected:mu,rel,source_kind,citation,locator\n'
      + 'ok,300,0.7,1.8e-5,0.01,memory,handbook,\n'
      + 'bad number,3OO,0.7,1.8e-5,0.01,memory,handbook,\n'
      + 'no locator,300,0.7,1.8e-5,0.01,published,a book,\n'
      + ',300,0.7,1.8e-5,0.01,guess,handbook,\n';
    const { rows } = parseCheckCaseCsv(csv, def);
    expect(rows.map((r) => r.line)).toEqual([2, 3, 4, 5]);
    expect(rows[0].checkCase).not.toBeNull();
    expect(rows[1]).toMatchObject({ checkCase: null, errors: ['T: "3OO" is not a number'] });
    expect(rows[2].errors).toEqual(['source: "locator" is required here']);
    expect(rows[3].errors).toEqual(expect.arrayContaining(['label: must not be empty', expect.stringMatching(/^source\.kind: must be one of/)]));
  });

  it('refuses unknown columns, missing inputs and oversized files as a whole', () => {
    expect(parseCheckCaseCsv('label,T,expected:Nu\nx,1,2\n', def).fileErrors).toEqual([
      'Column "expected:Nu": "Nu" is not an output (outputs: mu).', 'No column for the input "Pr".',
    ]);
    expect(parseCheckCaseCsv(`label,T,Pr\n${'a,1,1\n'.repeat(1001)}`, def).fileErrors[0]).toMatch(/at most 1000/);
    expect(parseCheckCaseCsv('x'.repeat(1_000_001), def).fileErrors[0]).toMatch(/larger than 1 MB/);
  });
});
