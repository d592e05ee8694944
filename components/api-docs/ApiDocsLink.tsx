import { useRouter } from 'expo-router';
import { Button } from '../ui/Button';

/** The way from the Account screen (where tokens are made) to the API page. */
export function ApiDocsLink() {
  const router = useRouter();
  return <Button label="API for integrators" tone="secondary" onPress={() => router.push('/api-docs')} testID="account-api-docs" accessibilityHint="Opens the list of API routes and how to use a token" />;
}
