// The one flight-safety caution every command, report, page and figure prints, so the wording
// never drifts between them. Results of a simulator or a replay cannot make a flight safe.
export const SAFETY_CAUTION =
  'Simulation and replay results clear nothing for flight. Flight tests follow local aviation rules and licensed practice, with a safety pilot, a geofence and a kill switch.';

/**
 * The short form where a line has no room for the whole caution (figure footers): its first
 * sentence, cut from SAFETY_CAUTION itself so the two cannot drift apart.
 */
export const SAFETY_CAUTION_SHORT = SAFETY_CAUTION.slice(0, SAFETY_CAUTION.indexOf('.') + 1);
