import { render, screen } from '@testing-library/react';
import { Text } from 'react-native';
import { RequirePermission } from '../../components/shell/RequirePermission';

const mockRole = { value: 'viewer' };
jest.mock('expo-router', () => ({ useRouter: () => ({ replace: jest.fn() }) }));
jest.mock('../../components/queries/auth', () => ({
  useMeQuery: () => ({ data: { current: { id: 1, name: 'Org', role: mockRole.value } } }),
}));

const page = () => (
  <RequirePermission permission="networks:write" title="Draw a network" what="draw networks" backTo="/networks">
    <Text>editor</Text>
  </RequirePermission>
);

describe('RequirePermission (reads the one permission table, shared/permissions.ts)', () => {
  test('a viewer who opens the drawing address gets an explanation, not the editor', () => {
    mockRole.value = 'viewer';
    render(page());
    expect(screen.queryByText('editor')).toBeNull();
    expect(screen.getByTestId('permission-refused').textContent).toContain('Your role (viewer) cannot draw networks');
  });

  test('a dispatcher gets the editor', () => {
    mockRole.value = 'dispatcher';
    render(page());
    expect(screen.getByText('editor')).toBeTruthy();
    expect(screen.queryByTestId('permission-refused')).toBeNull();
  });
});
