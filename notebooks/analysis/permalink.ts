// The permalink: the analysis file's text, UTF-8, base64url, in the URL fragment (#analysis=...).
// The fragment never reaches the server, so a shared link carries the analysis and nothing else.

const KEY = 'analysis=';

export function permalinkFragment(analysisText: string): string {
  const bytes = new TextEncoder().encode(analysisText);
  let binary = '';
  for (let i = 0; i < bytes.length; i++) binary += String.fromCharCode(bytes[i]!);
  return '#' + KEY + btoa(binary).replace(/\+/g, '-').replace(/\//g, '_').replace(/=+$/, '');
}

/** The analysis text in a fragment, or null when the fragment carries none. Throws on a damaged one. */
export function analysisTextFromFragment(fragment: string): string | null {
  const body = fragment.startsWith('#') ? fragment.slice(1) : fragment;
  if (!body.startsWith(KEY)) return null;
  const encoded = body.slice(KEY.length).replace(/-/g, '+').replace(/_/g, '/');
  if (!/^[A-Za-z0-9+/]*$/.test(encoded)) throw new Error('the link\'s analysis is damaged (characters outside base64url)');
  const binary = atob(encoded + '='.repeat((4 - (encoded.length % 4)) % 4));
  const bytes = Uint8Array.from(binary, (c) => c.charCodeAt(0));
  return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
}
