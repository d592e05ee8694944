import { ratiosOf } from '../../bench/all';

describe('npm run bench: web and runs-list ratios', () => {
  test('the web metrics line becomes the four issue targets; the slower sign-in counts', () => {
    const out = 'WEB-METRICS {"firstFormSeconds":2.4,"firstBytes":640000,"firstListSeconds":1.1,"firstListBytes":90000,"repeatFormSeconds":0.8,"repeatBytes":9000,"repeatListSeconds":1.6,"repeatListBytes":5000,"runScreenRequestsPerMinute":2}';
    const rows = ratiosOf('web', out);
    expect(rows.map((r) => [r.measured, r.target])).toEqual([[2.4, 3], [640, 1000], [0.8, 1], [1.6, 2]]);
  });

  test('the runs list p95 is read from the load metrics, from the table when reused', () => {
    const line = 'LOAD-METRICS {"worstP95Ms":180,"worstP99Ms":300,"drainSeconds":6,"drainRuns":100,"rows":[{"route":"GET /runs","p95":88.5},{"route":"GET /networks","p95":70}]}';
    expect(ratiosOf('load', line).find((r) => r.metric.startsWith('runs list'))).toMatchObject({ measured: 88.5, target: 100 });
    const table = ['### List and get routes, 50 concurrent connections', '', '| route | SQL/answer | requests | req/s | p50 ms | p95 ms | p99 ms |', '|---|---|---|---|---|---|---|', '| `GET /runs` | 4 | 10 | 5 | 40.0 | 97.2 | 120.0 |'].join('\n');
    expect(ratiosOf('load', table).find((r) => r.metric.startsWith('runs list'))).toMatchObject({ measured: 97.2, target: 100 });
  });
});
