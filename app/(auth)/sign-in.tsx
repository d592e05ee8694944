import { SignInForm } from '../../components/auth/SignInForm';

export default function SignInScreen() {
  return <SignInForm />;
}
