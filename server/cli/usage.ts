/** The help text; every flag the parser accepts is listed here. */
export const USAGE = `usage:
  spinyard solve FILE --solver NAME [--problem maxcut|bisection|kway] [--k K]
                 [--layers P] [--shots M] [--set KEY=VALUE ...] [--seed S]
                 [--time-limit SECONDS] [--tolerance T] [--pin ID=SIDE ...]
                 [--depots DEPOTS.csv] [--format FORMAT] [--no-bounds] [--json] [--progress]
                 [--qasm OUT.qasm] [--qasm-version 2|3] [--qasm-layout all|line|grid]
                 [--qasm-form bound|parameterised] [--device KEY=VALUE ...]
                 [--noise] [--noise-layout all|line|grid] [--noise-trajectories N] [--noise-shots S]
  spinyard solve --operator OPERATOR --solver vqe|qaoa [--layers P] [--set KEY=VALUE ...]
                 [--seed S] [--time-limit SECONDS] [--json] [--qasm OUT.qasm …]
  spinyard inspect --operator OPERATOR [--precision EPS] [--json]
  spinyard inspect FILE [--problem …] [--k K] [--tolerance T] [--pin ID=SIDE ...]
                 [--precision EPS] [--depots DEPOTS.csv] [--format FORMAT] [--json]
  spinyard solvers [--json]
  spinyard help

FILE formats (by extension): .txt edge list "n m" then "i j w" (G-set / Biq Mac layout),
.csv lanes from,to,weight (depots id,name,lat,lon,weight via --depots), .json Spinyard
network document, .graphml, .geojson. --format edgelist|csv|json|graphml|geojson overrides.
OPERATOR: "spinyard-operator 1" text or JSON, or a QUBO matrix as .csv (n rows of n numbers).
Defaults: --problem maxcut, --k 3 (kway), --seed 1, --time-limit 10, --tolerance 0,
--qasm-version 3, --qasm-layout all, --qasm-form bound (variational solvers only),
--noise-layout line, --noise-trajectories 20, --noise-shots 100.
Exit codes: 0 done, 2 bad input (file, flags, settings, refusal), 1 internal error,
130 cancelled with Ctrl-C (the best answer so far is still printed).
See docs/cli.md.`;
