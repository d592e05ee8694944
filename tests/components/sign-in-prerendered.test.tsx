import { render, screen, waitFor } from '@testing-library/react';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { SignInForm } from '../../components/auth/SignInForm';

jest.mock('expo-router', () => ({
  useRouter: () => ({ push: jest.fn(), replace: jest.fn() }),
  useLocalSearchParams: () => ({}),
  Link: (props: { children: React.ReactNode }) => props.children,
}));
jest.mock('../../components/api/client', () => ({ api: { get: jest.fn(), post: jest.fn() }, ApiError: class extends Error {} }));

function show() {
  render(
    <QueryClientProvider client={new QueryClient()}>
      <SignInForm />
    </QueryClientProvider>,
  );
}

afterEach(() => document.getElementById('prerendered')?.remove());

test('the live form takes over from the prerendered copy: typed values and focus move over, the copy goes', async () => {
  // What the page's HTML holds before scripts run (server/lib/prerender.ts), after some typing.
  const layer = document.createElement('div');
  layer.id = 'prerendered';
  layer.innerHTML = '<input data-testid="sign-in-email"><input data-testid="sign-in-password" type="password">';
  document.body.appendChild(layer);
  const [email, password] = Array.from(layer.querySelectorAll('input'));
  email.value = 'ada@quillmere.example';
  password.value = 'half-typ';
  password.focus();
  show();
  await waitFor(() => expect((screen.getByTestId('sign-in-email') as HTMLInputElement).value).toBe('ada@quillmere.example'));
  expect(document.getElementById('prerendered')).toBeNull();
  expect(screen.getAllByTestId('sign-in-email')).toHaveLength(1);
  expect((screen.getByTestId('sign-in-password') as HTMLInputElement).value).toBe('half-typ');
  expect((document.activeElement as HTMLElement).dataset.testid).toBe('sign-in-password');
});

test('without a copy the form starts empty', () => {
  show();
  expect((screen.getByTestId('sign-in-email') as HTMLInputElement).value).toBe('');
});
