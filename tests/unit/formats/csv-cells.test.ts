/**
 * Every CSV the product writes (network lanes and depots, the run assignment) goes through
 * writeCsvTable, which neutralises text cells a spreadsheet would run as a formula: those that
 * begin with = + - @, TAB or CR get a leading apostrophe (OWASP Foundation, "CSV Injection",
 * owasp.org/www-community/attacks/CSV_Injection; from memory). Our CSV reader removes exactly that
 * apostrophe, so an export reads back as the same network.
 */
import fc from 'fast-check';
import Papa from 'papaparse';
import { neutraliseCsvText, restoreCsvText, writeCsvTable } from '../../../shared/formats/csv-cells';
import { parseCsvNetwork, writeDepotsCsv, writeLanesCsv } from '../../../shared/formats/csv';
import type { NetworkDocument } from '../../../shared/engine/network/types';

const TRIGGER = /^[=+\-@\t\r]/;
const NUMBER_LITERAL = /^-?\d+(\.\d+)?(e[+-]\d+)?$/;
const rawCells = (csv: string) => Papa.parse<string[]>(csv, { skipEmptyLines: true }).data;

/** Text with formula triggers, apostrophes, quotes, commas and tabs where it hurts most. */
const hostile = fc.stringMatching(/^['=+\-@]{0,3}[A-Za-z0-9 ,"'=+\-@\t;]{0,6}$/);
const hostileId = hostile.filter((s) => s.trim() === s && s !== '');

describe('the formula guard for text cells', () => {
  test.each([
    ['=HYPERLINK("http://example.invalid","x")', `'=HYPERLINK("http://example.invalid","x")`],
    ['+1+2', "'+1+2"],
    ['-2+3', "'-2+3"],
    ['@SUM(A1)', "'@SUM(A1)"],
    ['\tcmd', "'\tcmd"],
    ['\rcmd', "'\rcmd"],
    ["'=x", "''=x"], // an apostrophe before a trigger gets one more, so reading back is exact
    ["'plain", "'plain"],
    ['Quillmere Cross', 'Quillmere Cross'],
  ])('%j is written as %j', (text, written) => {
    expect(neutraliseCsvText(text)).toBe(written);
    expect(restoreCsvText(written)).toBe(text);
  });

  test('any text: the written cell never starts a formula, and reading it back gives the text', () => {
    fc.assert(fc.property(fc.oneof(hostile, fc.string()), (text) => {
      const cell = neutraliseCsvText(text);
      expect(cell).not.toMatch(TRIGGER);
      expect(restoreCsvText(cell)).toBe(text);
    }), { numRuns: 500 });
  });

  test('numbers stay number literals (a negative longitude is a number, not a formula)', () => {
    const csv = writeCsvTable(['id', 'lon'], [['=A1', -31.25], ['B', 4e-7]]);
    expect(rawCells(csv)).toEqual([['id', 'lon'], ["'=A1", '-31.25'], ['B', '4e-7']]);
    expect(() => writeCsvTable(['x'], [[Number.NaN]])).toThrow('cannot write NaN');
  });
});

describe('network CSV exports', () => {
  const doc: NetworkDocument = {
    depots: [
      { id: '=1+1', name: '@Quillmere Cross', lat: 47.1, lon: -31.25, weight: 2 },
      { id: '+North', name: '-Sorrowby' },
      { id: "'=quoted", name: 'Tarnwyth' },
      { id: 'Plain' },
    ],
    lanes: [{ from: '=1+1', to: '+North', weight: 5 }, { from: "'=quoted", to: 'Plain', weight: 0.5 }, { from: 'Plain', to: '=1+1', weight: 12 }],
  };

  test('no text cell of the lanes or depots file starts a formula', () => {
    for (const [csv, numeric] of [[writeLanesCsv(doc), [2]], [writeDepotsCsv(doc), [2, 3, 4]]] as const) {
      for (const row of rawCells(csv).slice(1)) {
        row.forEach((cell, c) => {
          if ((numeric as readonly number[]).includes(c)) expect(cell === '' || NUMBER_LITERAL.test(cell)).toBe(true);
          else expect(cell).not.toMatch(TRIGGER);
        });
      }
    }
  });

  test('re-importing the export gives the same network', () => {
    const r = parseCsvNetwork({ name: 'lanes.csv', content: writeLanesCsv(doc) }, { name: 'depots.csv', content: writeDepotsCsv(doc) });
    expect(r.issues).toEqual([]);
    expect(r.document).toEqual(doc);
  });

  test('round trip for any network with hostile ids and names', () => {
    const arb = fc.uniqueArray(hostileId, { minLength: 2, maxLength: 8 }).chain((ids) =>
      fc.record({
        names: fc.array(fc.option(hostileId, { nil: undefined }), { minLength: ids.length, maxLength: ids.length }),
        weights: fc.array(fc.integer({ min: 0, max: 99 }), { minLength: ids.length - 1, maxLength: ids.length - 1 }),
      }).map(({ names, weights }): NetworkDocument => ({
        depots: ids.map((id, i) => (names[i] === undefined ? { id } : { id, name: names[i] })),
        lanes: weights.map((w, i) => ({ from: ids[i], to: ids[i + 1], weight: w })),
      })));
    fc.assert(fc.property(arb, (d) => {
      const r = parseCsvNetwork({ name: 'lanes.csv', content: writeLanesCsv(d) }, { name: 'depots.csv', content: writeDepotsCsv(d) });
      expect(r.issues.filter((i) => i.severity === 'error')).toEqual([]);
      expect(r.document).toEqual(d);
    }), { numRuns: 200 });
  });
});

describe('rows with more fields than the header', () => {
  const lanes = (content: string) => ({ name: 'lanes.csv', content });

  test('a decimal comma (CV06,CV07,1,5) is an error with its fix, not volume 1', () => {
    const r = parseCsvNetwork(lanes('from,to,weight\nCV05,CV06,2\nCV06,CV07,1,5\n'));
    expect(r.issues).toEqual([expect.objectContaining({ file: 'lanes.csv', line: 3, where: 'lanes', severity: 'error' })]);
    expect(r.issues[0].message).toContain('"1,5" looks like a number written with a decimal comma; write 1.5');
    expect(r.document.lanes).toEqual([{ from: 'CV05', to: 'CV06', weight: 2 }]);
  });

  test('other extra fields: an error saying how many and what to do; trailing empty fields are fine', () => {
    const r = parseCsvNetwork(lanes('from,to,weight\nA,B,1,\nB,C,2,x,y\n'));
    expect(r.document.lanes).toEqual([{ from: 'A', to: 'B', weight: 1 }]);
    expect(r.issues).toHaveLength(1);
    expect(r.issues[0]).toMatchObject({ line: 3, severity: 'error' });
    expect(r.issues[0].message).toBe('the row has 5 fields but the header has 3 (from,to,weight); remove the extra fields, or put quotes around a value that contains the delimiter');
  });

  test('the depots file follows the same rule', () => {
    const r = parseCsvNetwork(lanes('from,to,weight\nA,B,1\n'), { name: 'depots.csv', content: 'id,name,lat,lon,weight\nA,Alpha,47.1,-31.2,2,5\nB,Beta,,,\n' });
    const errors = r.issues.filter((i) => i.severity === 'error');
    expect(errors[0]).toMatchObject({ file: 'depots.csv', line: 2, where: 'depots' });
    expect(errors[0].message).toContain('write 2.5');
  });
});
