import { SignUpForm } from '../../components/auth/SignUpForm';

export default function SignUpScreen() {
  return <SignUpForm />;
}
