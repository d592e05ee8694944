import { act, render, screen } from '@testing-library/react';
import { SafeAreaProvider } from 'react-native-safe-area-context';
import { AppShell } from '../../components/shell/AppShell';
import type { Role } from '../../shared/permissions';

jest.mock('expo-router', () => ({
  usePathname: () => '/runs',
  Link: ({ children }: { children: unknown }) => children,
}));

function setWindowWidth(width: number) {
  act(() => {
    // react-native-web reads the viewport from documentElement.clientWidth in jsdom.
    Object.defineProperty(document.documentElement, 'clientWidth', { configurable: true, value: width });
    window.dispatchEvent(new Event('resize'));
  });
}

function renderShell(role: Role) {
  return render(
    <SafeAreaProvider initialMetrics={{ frame: { x: 0, y: 0, width: 390, height: 844 }, insets: { top: 0, left: 0, right: 0, bottom: 0 } }}>
      <AppShell organisationName="Test Org" role={role}>
        <></>
      </AppShell>
    </SafeAreaProvider>,
  );
}

const navLabels = () => screen.getAllByRole('link').map((el) => el.getAttribute('aria-label'));

describe('AppShell', () => {
  test('phone width: a bottom bar with the destinations the role may see, the current one selected', () => {
    setWindowWidth(390);
    renderShell('viewer');
    expect(screen.getByTestId('shell-tabbar')).toBeTruthy();
    expect(screen.queryByTestId('shell-rail')).toBeNull();
    expect(screen.getByTestId('shell-org-name').textContent).toBe('Test Org');
    // Viewers lack billing:read in the permission table (shared/permissions.ts), so Billing is hidden.
    expect(navLabels()).toEqual(['Networks', 'Runs', 'Team', 'Account']);
    expect(screen.getByRole('link', { name: 'Runs' }).getAttribute('aria-current')).toBe('page');
    expect(screen.getByRole('link', { name: 'Networks' }).getAttribute('aria-current')).toBeNull();
    // Our own active treatment: one signal lamp, on the current destination only.
    const lamps = screen.getAllByTestId('nav-lamp');
    expect(lamps).toHaveLength(1);
    expect(screen.getByRole('link', { name: 'Runs' }).contains(lamps[0])).toBe(true);
  });

  test('wide screen (≥ 1024 px): a side rail instead of the bottom bar; admins see Billing', () => {
    setWindowWidth(1440);
    renderShell('admin');
    expect(screen.getByTestId('shell-rail')).toBeTruthy();
    expect(screen.queryByTestId('shell-tabbar')).toBeNull();
    expect(navLabels()).toEqual(['Networks', 'Runs', 'Team', 'Billing', 'Account']);
  });
});
