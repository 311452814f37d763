// @vitest-environment jsdom
import { afterEach, beforeAll, beforeEach, describe, it, expect, vi } from 'vitest';
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { waitFor, within } from '@testing-library/dom';

const router = vi.hoisted(() => ({ push: vi.fn(), refresh: vi.fn(), replace: vi.fn() }));
const archiveIngredientAction = vi.hoisted(() => vi.fn());

vi.mock('next/navigation', () => ({ useRouter: () => router, usePathname: () => '/', useSearchParams: () => new URLSearchParams() }));
vi.mock('@/lib/ingredients/actions', () => ({ archiveIngredientAction, saveIngredientAction: vi.fn() }));

import { ArchiveIngredientButton } from '@/components/ingredients/ArchiveIngredientButton';

// jsdom has <dialog> but not its modal methods.
beforeAll(() => {
  HTMLDialogElement.prototype.showModal ??= function showModal(this: HTMLDialogElement) {
    this.setAttribute('open', '');
  };
  HTMLDialogElement.prototype.close ??= function close(this: HTMLDialogElement) {
    this.removeAttribute('open');
  };
});
beforeEach(() => {
  archiveIngredientAction.mockReset();
  router.refresh.mockReset();
});
afterEach(cleanup);

const ID = '0b7f6c1e-3a8d-4f2b-9c1d-2e5f6a7b8c91';

describe('ArchiveIngredientButton', () => {
  it('asks first, explains what archiving means, then archives and refreshes', async () => {
    archiveIngredientAction.mockResolvedValue({ ok: true, data: undefined });
    render(<ArchiveIngredientButton ingredientId={ID} name="Orchard fruit pulp" archived={false} />);
    fireEvent.click(screen.getByRole('button', { name: 'Archive Orchard fruit pulp' }));
    const dialog = screen.getByRole('dialog', { name: 'Archive Orchard fruit pulp?' });
    expect(within(dialog).getByText(/Archived ingredients stay in old revisions but cannot be added to new lines/)).toBeTruthy();
    expect(archiveIngredientAction).not.toHaveBeenCalled();
    fireEvent.click(within(dialog).getByRole('button', { name: 'Archive' }));
    await waitFor(() => expect(archiveIngredientAction).toHaveBeenCalledWith(ID, true));
    await waitFor(() => expect(router.refresh).toHaveBeenCalled());
  });

  it('restores an archived ingredient, and shows a refusal', async () => {
    archiveIngredientAction.mockResolvedValue({ ok: false, status: 403, error: 'You cannot change the library.' });
    render(<ArchiveIngredientButton ingredientId={ID} name="Orchard fruit pulp" archived />);
    fireEvent.click(screen.getByRole('button', { name: 'Restore Orchard fruit pulp' }));
    fireEvent.click(within(screen.getByRole('dialog')).getByRole('button', { name: 'Restore' }));
    await waitFor(() => expect(archiveIngredientAction).toHaveBeenCalledWith(ID, false));
    expect((await screen.findByRole('alert')).textContent).toBe('You cannot change the library.');
    expect(router.refresh).not.toHaveBeenCalled();
  });

  it('does nothing on Cancel', () => {
    render(<ArchiveIngredientButton ingredientId={ID} name="Orchard fruit pulp" archived={false} />);
    fireEvent.click(screen.getByRole('button', { name: 'Archive Orchard fruit pulp' }));
    fireEvent.click(screen.getByRole('button', { name: 'Cancel' }));
    expect(archiveIngredientAction).not.toHaveBeenCalled();
    expect(screen.queryByRole('dialog')).toBeNull();
  });
});
