// @vitest-environment happy-dom
// The invoice's variations and a credit note's lines drop blank rows before sending, so the
// server's `variations.N` / `lines.N` names the Nth row sent: the message must land on that row,
// not on the blank row above it.
import { cleanup, fireEvent, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Invoice } from '../../shared/api/invoices';
import { CreditNoteForm } from '../../src/features/invoices/components/credit-note-form';
import { InvoiceEditForm } from '../../src/features/invoices/components/invoice-edit-form';
import { demoUser, fakeApi, renderPage, type FakeCall } from './render';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const invoice: Invoice = {
  id: '66666666-6666-4666-8666-666666666666',
  kind: 'invoice',
  number: 'INV-0007',
  jobId: '44444444-4444-4444-8444-444444444444',
  jobReference: 'J-0007',
  customerName: 'Ada Penrose',
  status: 'issued',
  overdue: false,
  issueDate: '2030-01-10',
  dueDate: '2030-02-09',
  currency: 'GBP',
  grossMinor: 12000,
  balanceMinor: 12000,
  paidAt: null,
  quoteId: null,
  quoteReference: null,
  creditedInvoiceId: null,
  creditedInvoiceNumber: null,
  customerEmail: 'ada.penrose@example.com',
  billingAddress: ['1 Test Row', 'Kelsworth'],
  lines: [],
  netMinor: 10000,
  taxMinor: 2000,
  taxByRate: [],
  depositMinor: 0,
  creditedMinor: 0,
  notes: '',
  reason: '',
  creditNotes: [],
  sentAt: null,
  payUrl: null,
};

const set = (label: string | RegExp, value: string) => fireEvent.change(screen.getByLabelText(label), { target: { value } });
function errorFor(label: string): string | null {
  const el = screen.getByLabelText(label);
  if (el.getAttribute('aria-invalid') !== 'true') return null;
  const id = el.getAttribute('aria-describedby')?.split(' ')[0];
  return id ? (document.getElementById(id)?.textContent ?? null) : null;
}
const rejecting = (path: string, calls: FakeCall[] = []) =>
  fakeApi((call) => {
    calls.push(call);
    if (call.method === 'GET') return { body: {} };
    return { status: 422, body: { error: { code: 'validation_failed', message: 'invalid body', details: [{ path, message: 'above the quoted rate' }] } } };
  });

describe('line tables with a blank row above the one the server named', () => {
  it("places the invoice's variations.0 on row 2 when row 1 is blank", async () => {
    const calls = rejecting('variations.0.unitPriceMinor');
    renderPage(<InvoiceEditForm invoice={invoice} />, { user: demoUser('office') });
    fireEvent.click(screen.getByRole('button', { name: 'Add a line' }));
    fireEvent.click(screen.getByRole('button', { name: 'Add a line' }));
    set('Line 2 description', 'Extra loft hatch draught seal');
    set('Line 2 unit price', '45.00');
    fireEvent.click(screen.getByRole('button', { name: 'Save changes' }));
    await waitFor(() => expect(errorFor('Line 2 unit price')).toBe('above the quoted rate'));
    expect(errorFor('Line 1 unit price')).toBeNull();
    // One row was sent: the blank one was left out.
    const patch = calls.find((c) => c.method === 'PATCH');
    expect((patch?.body as { variations: unknown[] }).variations).toHaveLength(1);
  });

  it("places a credit note's lines.1 on row 3 when row 2 is blank", async () => {
    rejecting('lines.1.quantity');
    renderPage(<CreditNoteForm invoice={invoice} />, { user: demoUser('office') });
    set(/^Reason/, 'walkway boards not fitted');
    set('Line 1 description', 'Credit: walkway boards');
    set('Line 1 unit price', '30.00');
    fireEvent.click(screen.getByRole('button', { name: 'Add a line' }));
    fireEvent.click(screen.getByRole('button', { name: 'Add a line' }));
    set('Line 3 description', 'Credit: hatch insulation');
    set('Line 3 unit price', '12.00');
    fireEvent.click(screen.getByRole('button', { name: /credit note/i }));
    await waitFor(() => expect(errorFor('Line 3 quantity')).toBe('above the quoted rate'));
    expect(errorFor('Line 2 quantity')).toBeNull();
  });
});
