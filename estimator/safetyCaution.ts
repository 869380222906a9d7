// The one flight-safety caution every command, report, page and figure prints, so the wording
// never drifts between them. Results of a simulator or a replay cannot make a flight safe.
export const SAFETY_CAUTION =
  'Simulation and replay results clear nothing for flight. Flight tests follow local aviation rules and licensed practice, with a safety pilot, a geofence and a kill switch.';
