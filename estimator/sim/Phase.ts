// The landing supervisor's phases, in the order a landing passes through them (supervisor.ts).
// Its own file so the trial result and the failure events can both name it.

export type Phase = 'acquire' | 'trail' | 'align' | 'descend' | 'touchdown';
export const PHASES: readonly Phase[] = ['acquire', 'trail', 'align', 'descend', 'touchdown'];
