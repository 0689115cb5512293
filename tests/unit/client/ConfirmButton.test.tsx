import { cleanup, fireEvent, render, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { ConfirmButton } from '#src/components/ConfirmButton';
import { ApiError } from '#src/lib/api-client';

afterEach(cleanup);

function renderDelete(onConfirm: () => Promise<unknown>) {
  render(
    <ConfirmButton title="Delete Hill-climb?" description="This cannot be undone." confirmLabel="Delete team" cancelLabel="Keep team" onConfirm={onConfirm}>
      Delete team
    </ConfirmButton>,
  );
}

describe('ConfirmButton', () => {
  it('asks before acting, and Cancel does nothing', () => {
    const onConfirm = vi.fn(async () => undefined);
    renderDelete(onConfirm);
    fireEvent.click(screen.getByRole('button', { name: 'Delete team' }));
    const dialog = screen.getByRole('dialog', { name: 'Delete Hill-climb?' });
    expect(dialog).toBeTruthy();
    // The safe choice has focus first.
    expect(document.activeElement).toBe(screen.getByRole('button', { name: 'Keep team' }));
    fireEvent.click(screen.getByRole('button', { name: 'Keep team' }));
    expect(screen.queryByRole('dialog')).toBeNull();
    expect(onConfirm).not.toHaveBeenCalled();
  });

  it('acts on confirmation and closes', async () => {
    const onConfirm = vi.fn(async () => undefined);
    renderDelete(onConfirm);
    fireEvent.click(screen.getByRole('button', { name: 'Delete team' }));
    fireEvent.click(screen.getAllByRole('button', { name: 'Delete team' })[1]);
    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());
    expect(onConfirm).toHaveBeenCalledTimes(1); // one click, one call
  });

  it('keeps the dialog open with the server message when the action fails', async () => {
    const onConfirm = vi.fn(async () => {
      throw new ApiError({ status: 409, code: 'last_owner', message: 'A team needs at least one owner.' });
    });
    renderDelete(onConfirm);
    fireEvent.click(screen.getByRole('button', { name: 'Delete team' }));
    fireEvent.click(screen.getAllByRole('button', { name: 'Delete team' })[1]);
    expect(await screen.findByText('A team needs at least one owner.')).toBeTruthy();
    expect(screen.getByRole('dialog')).toBeTruthy();
  });

  it('closes on Escape', () => {
    renderDelete(async () => undefined);
    fireEvent.click(screen.getByRole('button', { name: 'Delete team' }));
    fireEvent.keyDown(document, { key: 'Escape' });
    expect(screen.queryByRole('dialog')).toBeNull();
  });
});
