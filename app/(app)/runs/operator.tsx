import { useWindowDimensions } from 'react-native';
import { OperatorWorkbench } from '../../../components/operators/OperatorWorkbench';
import { RequirePermission } from '../../../components/shell/RequirePermission';
import { WIDE_BREAKPOINT } from '../../../components/theme';

/** /runs/operator — operators of your own (analysts and up, runs:advanced). */
export default function OperatorScreen() {
  const { width } = useWindowDimensions();
  return (
    <RequirePermission permission="runs:advanced" title="Operator of your own" what="run operators of your own (analysts and up)" backTo="/runs">
      <OperatorWorkbench wide={width >= WIDE_BREAKPOINT} />
    </RequirePermission>
  );
}
