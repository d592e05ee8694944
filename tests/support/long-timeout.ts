// Suites that start servers and browsers need more than jest's default 5 s.
jest.setTimeout(120_000);
