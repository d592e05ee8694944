import fc from 'fast-check';
import type { Depot, Lane, NetworkDocument } from '../../../shared/engine/network/types';

/** Ids and names with the characters writers must escape (comma, quotes, &, <, >, accents). */
const TEXT = /^[A-Za-z0-9éü][A-Za-z0-9éü _\-.,"'&<>;|]{0,7}$/;
export const textArb = fc.stringMatching(TEXT).filter((s) => s === s.trim());

const positive = fc.oneof(fc.integer({ min: 0, max: 1000 }), fc.double({ min: 0, max: 1e6, noNaN: true, noDefaultInfinity: true })).map((w) => w + 0);
const signed = fc.oneof(fc.integer({ min: -10, max: 10 }), fc.double({ min: -1e6, max: 1e6, noNaN: true, noDefaultInfinity: true })).map((w) => w + 0);

export interface NetworkArbOptions {
  signedWeights?: boolean;
  /** Edge-list networks: ids "1"…"n", nothing but lanes. */
  numbered?: boolean;
}

/** Valid networks: unique ids, lanes between distinct depots, each depot pair at most once. */
export function networkArb(options: NetworkArbOptions = {}): fc.Arbitrary<NetworkDocument> {
  const weight = options.signedWeights ? signed : positive;
  const ids = options.numbered
    ? fc.integer({ min: 2, max: 12 }).map((n) => Array.from({ length: n }, (_, i) => String(i + 1)))
    : fc.uniqueArray(textArb, { minLength: 2, maxLength: 12 });
  return ids.chain((idList) => {
    const n = idList.length;
    const depot = (id: string): fc.Arbitrary<Depot> =>
      options.numbered
        ? fc.constant({ id })
        : fc.record({
            name: fc.option(textArb, { nil: undefined }),
            place: fc.option(fc.tuple(fc.double({ min: -90, max: 90, noNaN: true }), fc.double({ min: -180, max: 180, noNaN: true })), { nil: undefined }),
            weight: fc.option(positive, { nil: undefined }),
          }).map(({ name, place, weight: w }) => {
            const d: Depot = { id };
            if (name !== undefined) d.name = name;
            if (place) { d.lat = place[0] + 0; d.lon = place[1] + 0; }
            if (w !== undefined) d.weight = w;
            return d;
          });
    const pairs = fc.uniqueArray(
      fc.tuple(fc.integer({ min: 0, max: n - 1 }), fc.integer({ min: 0, max: n - 1 })).filter(([a, b]) => a !== b),
      { maxLength: 20, selector: ([a, b]) => (a < b ? `${a},${b}` : `${b},${a}`) },
    );
    return fc.record({
      depots: fc.tuple(...idList.map(depot)),
      lanes: pairs.chain((ps) => fc.tuple(...ps.map(([a, b]) => weight.map((w): Lane => ({ from: idList[a], to: idList[b], weight: w }))))),
      name: options.numbered ? fc.constant(undefined) : fc.option(textArb, { nil: undefined }),
    }).map(({ depots, lanes, name }) => {
      const doc: NetworkDocument = { depots: [...depots], lanes: [...lanes] };
      if (name !== undefined) doc.name = name;
      return doc;
    });
  });
}

/** Text made of format fragments, to reach deeper into parsers than uniform noise does. */
export const fragmentsArb = (fragments: string[]) =>
  fc.array(fc.oneof(fc.constantFrom(...fragments), fc.string({ maxLength: 6 })), { maxLength: 40 }).map((parts) => parts.join(''));

export const anyTextArb = fc.oneof(fc.string({ maxLength: 200 }), fc.string({ unit: 'binary', maxLength: 200 }));
