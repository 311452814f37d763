// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, render, screen, waitFor } from '@testing-library/react';
import type { RecordHome } from '@/lib/workspaces/record-home';

const switchWorkspaceAction = vi.hoisted(() => vi.fn());
vi.mock('@/lib/workspaces/actions', () => ({ switchWorkspaceAction }));

import { RecordElsewhere } from '@/components/workspaces/RecordElsewhere';

const HOME: RecordHome = {
  kind: 'trial',
  workspaceId: '0b8a4c1e-4f7e-4d1a-9c55-0d7f1c2a3b4c',
  workspaceName: 'Brackenfold Kitchen',
  roleLabel: 'Product developer',
  canOpen: true,
  opens: 'trials',
  returnPath: '/trials/5d1c2a3b-4c0b-4a1e-8f7e-4d1a9c550d7f/compare',
};

const assign = vi.fn();
Object.defineProperty(window, 'location', { value: { ...window.location, assign }, writable: true });

afterEach(() => {
  cleanup();
  switchWorkspaceAction.mockReset();
  assign.mockReset();
});

describe('the offer to switch workspace', () => {
  it('names the workspace and, on the button, switches to it and returns to the same page', async () => {
    switchWorkspaceAction.mockResolvedValue({ ok: true, data: { workspaceId: HOME.workspaceId } });
    render(<RecordElsewhere home={HOME} />);
    expect(screen.getByRole('heading', { level: 1 }).textContent).toBe('This trial is in Brackenfold Kitchen');
    expect(document.body.textContent).toContain('Switch to Brackenfold Kitchen to open it.');
    fireEvent.click(screen.getByRole('button', { name: 'Switch to Brackenfold Kitchen' }));
    await waitFor(() => expect(assign).toHaveBeenCalledWith(HOME.returnPath));
    expect(switchWorkspaceAction).toHaveBeenCalledWith(HOME.workspaceId);
  });

  it('shows the refusal of the switch and stays', async () => {
    switchWorkspaceAction.mockResolvedValue({ ok: false, status: 404, error: 'The workspace was not found.' });
    render(<RecordElsewhere home={HOME} />);
    fireEvent.click(screen.getByRole('button', { name: 'Switch to Brackenfold Kitchen' }));
    expect((await screen.findByRole('alert')).textContent).toBe('The workspace was not found.');
    expect(assign).not.toHaveBeenCalled();
  });

  it('offers no switch where the role held there cannot open the record, and says why', () => {
    render(<RecordElsewhere home={{ ...HOME, canOpen: false, roleLabel: 'Taster' }} />);
    expect(screen.queryByRole('button')).toBeNull();
    expect(document.body.textContent).toContain('Your role there (Taster) does not open trials.');
  });
});
