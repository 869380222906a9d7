// The permalink: the analysis file's text, UTF-8, base64url, in the URL fragment (#analysis=...).
// The fragment never reaches the server, so a shared link carries the analysis and nothing else.

const KEY = 'analysis=';

export function permalinkFragment(analysisText: string): string {
  const bytes = new TextEncoder().encode(analysisText);
  let binary = '';
  for (let i = 0; i < bytes.length; i++) binary += String.fromCharCode(bytes[i]!);
  return '#' + KEY + btoa(binary).replace(/\+/g, '-').replace(/\//g, '_').replace(/=+$/, '');
}

/** A link whose fragment cannot be read; the message is for a person, not a decoder's wording. */
export class PermalinkError extends Error {
  /** The study the link was probably meant for, when a damaged text still names one. */
  readonly studyHint: string | null;
  constructor(message: string, studyHint: string | null = null) {
    super(message);
    this.name = 'PermalinkError';
    this.studyHint = studyHint;
  }
}

/** The analysis text in a fragment, or null when the fragment carries none. Throws PermalinkError on a damaged one. */
export function analysisTextFromFragment(fragment: string): string | null {
  const body = fragment.startsWith('#') ? fragment.slice(1) : fragment;
  if (!body.startsWith(KEY)) return null;
  const encoded = body.slice(KEY.length).replace(/-/g, '+').replace(/_/g, '/');
  if (encoded === '') throw new PermalinkError('the link carries an empty analysis (nothing after "#analysis=")');
  const bad = /[^A-Za-z0-9+/]/.exec(encoded);
  if (bad) throw new PermalinkError(`the link's analysis is damaged: character ${JSON.stringify(bad[0])} at position ${bad.index + 1} is not base64url (was the link cut or edited?)`);
  // A base64 text of length 4k + 1 cannot come from whole bytes: the link lost characters.
  if (encoded.length % 4 === 1) throw new PermalinkError(`the link's analysis is damaged: ${encoded.length} base64url characters cannot encode whole bytes (was the link cut?)`);
  const binary = atob(encoded + '='.repeat((4 - (encoded.length % 4)) % 4));
  const bytes = Uint8Array.from(binary, (c) => c.charCodeAt(0));
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    // Read it leniently only to guess which study it was meant for.
    const loose = new TextDecoder('utf-8').decode(bytes);
    throw new PermalinkError("the link's analysis is damaged: its bytes are not UTF-8 text (was the link cut or edited?)", studyNamedIn(loose));
  }
}

/** The study id a (possibly broken) analysis text names, or null. */
export function studyNamedIn(text: string): string | null {
  return /"study"\s*:\s*"([a-z-]+)"/.exec(text)?.[1] ?? null;
}
