import { ApiDocsScreen } from '../../components/api-docs/ApiDocsScreen';

export default function ApiDocsRoute() {
  return <ApiDocsScreen />;
}
