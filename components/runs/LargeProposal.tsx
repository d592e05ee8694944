import { StyleSheet, View } from 'react-native';
import { space } from '../theme';
import { Notice } from '../ui/Notice';
import { Body, Small } from '../ui/Text';
import type { LargeProposal as Proposal } from './large-solvers';

/**
 * Run setup above the statevector limit: why QAOA and VQE are not proposed, and the two
 * large-network solvers with their time and price as the server's preview states them
 * (`lineOf` is setup-words' solverLine for that solver: qubits, about how long, what it costs).
 */
export function LargeProposal(props: { proposal: Proposal; chosen: readonly string[]; labelOf: (name: string) => string; lineOf: (name: string) => string | null }) {
  const { proposal } = props;
  return (
    <Notice testID="large-proposal">
      <View style={styles.stack}>
        <Body>
          QAOA and VQE would simulate {proposal.needed} qubits here, more than the {proposal.limit}-qubit limit of the statevector simulator{proposal.limit < 20 ? ' on your plan' : ''}.
          {proposal.proposed.length ? ' Proposed instead:' : ' No large-network quantum solver can take this question; the classical solvers still run.'}
        </Body>
        {proposal.proposed.map((name) => (
          <View key={name} testID={`large-proposal-${name}`}>
            <Body>{props.labelOf(name)}</Body>
            <Small testID={`large-proposal-line-${name}`}>{props.lineOf(name) ?? (props.chosen.includes(name) ? 'Checking time and price with the server…' : 'Not ticked below: tick it to include it and see its time and price.')}</Small>
          </View>
        ))}
        {proposal.proposed.length ? (
          <Small>Recursive QAOA fixes depots round by round from one-layer correlations; QAOA by blocks solves small blocks and then orients them. Both may polish their answer with classical local search, and the scorecard shows the value before it.</Small>
        ) : null}
      </View>
    </Notice>
  );
}

const styles = StyleSheet.create({ stack: { gap: space.sm } });
