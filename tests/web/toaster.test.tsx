import { act, fireEvent, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { Toaster } from '../../web/components/ui/toaster';
import { clearToasts, showToast, TOAST_VISIBLE_MS } from '../../web/components/ui/toast-store';

afterEach(() => {
  act(() => clearToasts());
  vi.useRealTimers();
});

const liveRegions = () => document.querySelectorAll('[aria-live], [role="status"], [role="alert"], [role="log"]');

describe('Toaster', () => {
  it('when messages show, then they sit in one polite live region with no live region inside it', () => {
    render(<Toaster />);
    act(() => {
      showToast('ok', 'Details saved.');
      showToast('danger', 'The list could not be loaded.');
    });
    expect(liveRegions()).toHaveLength(1);
    const region = screen.getByRole('status', { name: 'Messages' });
    expect(region).toHaveAttribute('aria-live', 'polite');
    expect(within(region).getByText('The list could not be loaded.')).toBeInTheDocument();
    expect(region.querySelectorAll('[aria-live], [role="status"], [role="alert"]')).toHaveLength(0);
  });

  it('when the pointer rests on a confirmation about to go, then it stays; it goes a few seconds after the pointer leaves', () => {
    vi.useFakeTimers();
    render(<Toaster />);
    act(() => showToast('ok', 'Details saved.'));
    const region = screen.getByRole('status', { name: 'Messages' });
    act(() => vi.advanceTimersByTime(TOAST_VISIBLE_MS - 1000));
    fireEvent.pointerEnter(region);
    act(() => vi.advanceTimersByTime(TOAST_VISIBLE_MS * 3));
    expect(screen.getByText('Details saved.')).toBeInTheDocument();
    fireEvent.pointerLeave(region);
    act(() => vi.advanceTimersByTime(4000));
    expect(screen.getByText('Details saved.')).toBeInTheDocument();
    act(() => vi.advanceTimersByTime(1500));
    expect(screen.queryByText('Details saved.')).not.toBeInTheDocument();
  });

  it('when focus is on a message, then it stays; a problem stays until its dismiss button is used', () => {
    vi.useFakeTimers();
    render(<Toaster />);
    act(() => {
      showToast('ok', 'Visit moved.');
      showToast('danger', 'The visit could not be moved.');
    });
    const dismissProblem = screen.getByRole('button', { name: 'Dismiss: The visit could not be moved.' });
    act(() => dismissProblem.focus());
    act(() => vi.advanceTimersByTime(TOAST_VISIBLE_MS * 2));
    expect(screen.getByText('Visit moved.')).toBeInTheDocument();
    act(() => dismissProblem.blur());
    act(() => vi.advanceTimersByTime(10 * 60_000));
    expect(screen.queryByText('Visit moved.')).not.toBeInTheDocument();
    // Ten minutes on, the problem is still there: it may need acting on.
    expect(screen.getByText('The visit could not be moved.')).toBeInTheDocument();
    fireEvent.click(screen.getByRole('button', { name: 'Dismiss: The visit could not be moved.' }));
    expect(screen.queryByText('The visit could not be moved.')).not.toBeInTheDocument();
  });
});
