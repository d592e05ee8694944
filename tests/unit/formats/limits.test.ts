import { readNetwork } from '../../../shared/formats';

const doc = (depots: object[], lanes: object[]) => JSON.stringify({ format: 'spinyard-network', version: 1, depots, lanes });
import { DepotIdSchema, DepotInputSchema } from '../../../shared/schemas/networks';

// The API refuses a depot id over the id limit; an import of the same depot must be refused
// too, or the network saves through one door and fails its next edit through the other.
describe('depot limits are the same for imports and the API', () => {
  const longId = 'Q'.repeat(121);
  const longName = 'Quillmere '.repeat(21); // 210 characters

  it('refuses a 121-character depot id in a CSV import, naming the line', () => {
    expect(DepotIdSchema.safeParse(longId).success).toBe(false);
    const csv = `from,to,weight\n${longId},Harrow Cross,12\nHarrow Cross,Fenwick Quay,3\n`;
    const result = readNetwork('lanes.csv', csv);
    const errors = result.issues.filter((i) => i.severity === 'error');
    expect(errors.some((i) => /120 characters/.test(i.message))).toBe(true);
    expect(result.document.depots.some((d) => d.id === longId) ?? false).toBe(false);
  });

  it('refuses a 121-character depot id in a JSON import', () => {
    const result = readNetwork('net.json', doc([{ id: longId }, { id: 'b' }], [{ from: longId, to: 'b', weight: 1 }]));
    expect(result.issues.some((i) => i.severity === 'error' && /120 characters/.test(i.message))).toBe(true);
  });

  it('refuses a depot name over 200 characters in an import as the API does', () => {
    expect(DepotInputSchema.safeParse({ id: 'a', name: longName }).success).toBe(false);
    const result = readNetwork('net.json', doc([{ id: 'a', name: longName }, { id: 'b' }], [{ from: 'a', to: 'b', weight: 1 }]));
    expect(result.issues.some((i) => i.severity === 'error' && /200 characters/.test(i.message))).toBe(true);
  });

  it('keeps a 120-character id', () => {
    const id = 'Q'.repeat(120);
    const result = readNetwork('net.json', doc([{ id }, { id: 'b' }], [{ from: id, to: 'b', weight: 1 }]));
    expect(result.issues.filter((i) => i.severity === 'error')).toEqual([]);
  });
});
