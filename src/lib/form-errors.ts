/** The server writes messages in lower case to sit beside a field; a strip on its own reads as a sentence. */
export function asSentence(message: string): string {
  const s = message.trim();
  if (!s) return s;
  return s[0].toUpperCase() + s.slice(1) + (/[.!?]$/.test(s) ? '' : '.');
}
