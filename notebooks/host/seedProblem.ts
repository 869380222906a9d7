// Reading the master seed a person typed: a whole number from 0 to 2^53 - 1 (the largest integer
// a JavaScript number holds exactly, so the seed in the link is the seed that ran), or a message
// that says what is wrong with the text. Nothing is rounded, clamped or replaced by 0.

/** The seed, or why the text is not one. */
export function seedProblem(text: string): number | string {
  const t = text.trim();
  if (t === '') return 'The seed is empty: type a whole number from 0 to 9007199254740991.';
  const value = Number(t);
  if (!Number.isFinite(value)) return `The seed ${JSON.stringify(t)} is not a number: type a whole number from 0 to 9007199254740991.`;
  if (value < 0) return `The seed ${t} is negative: seeds run from 0 to 9007199254740991.`;
  if (!Number.isInteger(value)) return `The seed ${t} is not a whole number: seeds have no fraction.`;
  if (!Number.isSafeInteger(value)) return `The seed ${t} is too large: seeds run up to 9007199254740991 (2^53 - 1), so that the link reproduces the same trials.`;
  if (!/^\d+$/.test(t)) return `The seed ${JSON.stringify(t)} is written oddly: type plain digits (${value}).`;
  return value;
}
