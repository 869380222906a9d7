// Touchdown judgement at the first contact, against the landing envelope. The contact
// geometry (deck frame miss, closing and lateral speed, tilt) comes from world/deckContact,
// so truth and judgement share one definition:
//   miss = hypot(along, across)          horizontal miss from the pad (= deck) centre, deck axes
// Outcome: off-carrier when the contact is not on the deck at all (the ground, or past the
// deck's edge: a different failure from a bad landing, and its miss can be metres), else
// hard-contact when the closing speed, lateral speed or tilt exceeds the envelope, else off-pad
// when miss > padRadius, else landed.
import type { LandingEnvelope } from './Scenario.js';
import type { Outcome } from './TrialResult.js';
import type { DeckContact } from './world/deckContact.js';

export interface TouchdownJudgement {
  outcome: Outcome;
  /** m; missX along travel, missY to the left, in the deck frame. */
  missDistance: number;
  missX: number;
  missY: number;
  /** m/s, m/s, deg. */
  closingSpeed: number;
  lateralSpeed: number;
  tiltDeg: number;
}

/** The parts of a contact the judgement reads (tilt in rad). */
export type ContactGeometry = Pick<DeckContact, 'along' | 'across' | 'onDeck' | 'closingSpeed' | 'lateralSpeed' | 'tilt'>;

/**
 * Judge a contact against the envelope.
 * @example judgeTouchdown(envelope, { along: 0.1, across: 0, onDeck: true, closingSpeed: 0.5, lateralSpeed: 0.1, tilt: 0 }).outcome // 'landed'
 */
export function judgeTouchdown(envelope: LandingEnvelope, contact: ContactGeometry): TouchdownJudgement {
  const missDistance = Math.hypot(contact.along, contact.across);
  const tiltDeg = (contact.tilt * 180) / Math.PI;
  let outcome: Outcome = 'landed';
  if (!contact.onDeck) {
    outcome = 'off-carrier';
  } else if (contact.closingSpeed > envelope.maxClosingSpeed || contact.lateralSpeed > envelope.maxLateralSpeed || tiltDeg > envelope.maxTiltDeg) {
    outcome = 'hard-contact';
  } else if (missDistance > envelope.padRadius) {
    outcome = 'off-pad';
  }
  return {
    outcome,
    missDistance,
    missX: contact.along,
    missY: contact.across,
    closingSpeed: contact.closingSpeed,
    lateralSpeed: contact.lateralSpeed,
    tiltDeg,
  };
}
