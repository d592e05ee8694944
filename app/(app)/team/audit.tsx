import { AuditLog } from '../../../components/team/AuditLog';

export default function AuditRoute() {
  return <AuditLog />;
}
