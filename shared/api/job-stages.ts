import type { Role } from '../auth/roles';
import type { JobStage } from './jobs';

/**
 * The moves a person may make by hand ("Move to" on the job page, PATCH /api/jobs/:id), from each
 * stage: forward one step along the trade's order, back one step to correct a slip, and declined
 * while nothing is booked. Sending a quote, the customer's answer, booking and finishing move the
 * job themselves and are not listed here.
 */
export const STAGE_MOVES: Readonly<Record<JobStage, readonly JobStage[]>> = {
  enquiry: ['surveyed', 'declined'],
  surveyed: ['enquiry', 'quoted', 'declined'],
  quoted: ['surveyed', 'accepted', 'declined'],
  accepted: ['quoted', 'scheduled', 'declined'],
  scheduled: ['accepted', 'installed'],
  installed: ['scheduled', 'closed'],
  closed: [],
  declined: [],
};

/**
 * The office's documented override, on top of STAGE_MOVES: cancel a booked job (scheduled or
 * installed → declined: the customer withdrew, the loft turned out unsafe), reopen a declined job
 * (→ enquiry or quoted: the customer came back) and reopen a closed one (→ installed: a snag to put
 * right). Estimators cannot: these undo bookings and bills the office is answerable for.
 */
export const OFFICE_STAGE_OVERRIDES: Readonly<Partial<Record<JobStage, readonly JobStage[]>>> = {
  scheduled: ['declined'],
  installed: ['declined'],
  declined: ['enquiry', 'quoted'],
  closed: ['installed'],
};

/** The stages a person with `role` may move a job to from `from`, in the order of JOB_STAGES' table. */
export function allowedStageMoves(from: JobStage, role: Role): JobStage[] {
  const moves = [...STAGE_MOVES[from]];
  if (role === 'office') for (const s of OFFICE_STAGE_OVERRIDES[from] ?? []) if (!moves.includes(s)) moves.push(s);
  return moves;
}

/** Whether `role` may move a job from `from` to `to` by hand (staying put is always fine). */
export function canMoveStage(from: JobStage, to: JobStage, role: Role): boolean {
  return from === to || allowedStageMoves(from, role).includes(to);
}
