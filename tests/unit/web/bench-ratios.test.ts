import { ratiosOf } from '../../bench/all';

describe('npm run bench: web and runs-list ratios', () => {
  test('the web metrics line becomes the four issue targets; the slower sign-in counts', () => {
    const out = 'WEB-METRICS {"firstFormSeconds":2.4,"firstBytes":640000,"firstListSeconds":1.1,"firstListBytes":90000,"repeatFormSeconds":0.8,"repeatBytes":9000,"repeatListSeconds":1.6,"repeatListBytes":5000,"runScreenRequestsPerMinute":2}';
    const rows = ratiosOf('web', out);
    expect(rows.map((r) => [r.measured, r.target])).toEqual([[2.4, 3], [640, 1000], [0.8, 1], [1.6, 2]]);
  });

  test('a reused web section is read from its "now" column', () => {
    const section = ['## Web', '', '| metric | before | now | target | ratio (now / target) |', '|---|---|---|---|---|', '| first visit: sign-in form shown | 24.10 s | 2.90 s | ≤ 3 s | 0.97 |', '| first visit: bytes to the sign-in form | 3637 kB | 420 kB | ≤ 1000 kB | 0.42 |', '| first visit: signing in → networks list | 3.00 s (10 kB) | 1.20 s (9 kB) | ≤ 2 s | 0.60 |', '| repeat visit: sign-in form shown | 6.00 s (1 kB) | 0.90 s (1 kB) | ≤ 1 s | 0.90 |', '| repeat visit: signing in → networks list | 2.50 s (3 kB) | 1.40 s (3 kB) | ≤ 2 s | 0.70 |'].join('\n');
    expect(ratiosOf('web', section).map((r) => r.measured)).toEqual([2.9, 420, 0.9, 1.4]);
  });

  test('the runs list p95 is read from the load metrics, from the table when reused', () => {
    const line = 'LOAD-METRICS {"worstP95Ms":180,"worstP99Ms":300,"drainSeconds":6,"drainRuns":100,"rows":[{"route":"GET /runs","p95":88.5},{"route":"GET /networks","p95":70}]}';
    expect(ratiosOf('load', line).find((r) => r.metric.startsWith('runs list'))).toMatchObject({ measured: 88.5, target: 100 });
    const table = ['### List and get routes, 50 concurrent connections', '', '| route | SQL/answer | requests | req/s | p50 ms | p95 ms | p99 ms |', '|---|---|---|---|---|---|---|', '| `GET /runs` | 4 | 10 | 5 | 40.0 | 97.2 | 120.0 |'].join('\n');
    expect(ratiosOf('load', table).find((r) => r.metric.startsWith('runs list'))).toMatchObject({ measured: 97.2, target: 100 });
  });
});
