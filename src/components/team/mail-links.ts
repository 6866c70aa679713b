export type MailPart = { kind: 'text'; text: string } | { kind: 'link'; text: string; href: string };

const URL_IN_TEXT = /\bhttps?:\/\/[^\s<>"']+/gi;
// Sentence punctuation after an address belongs to the sentence, not the address.
const TRAILING = /[.,;:!?)\]}'"]+$/;

/**
 * Splits a caught mail's text into plain text and links. Only http(s) addresses on this app's own
 * origin become links (as a path, so they open in the same tab); anything else stays text, so a
 * mail body can never send the browser somewhere else.
 */
export function splitMailLinks(text: string, origin: string): MailPart[] {
  const parts: MailPart[] = [];
  let last = 0;
  const pushText = (t: string) => {
    if (!t) return;
    const prev = parts[parts.length - 1];
    if (prev?.kind === 'text') prev.text += t;
    else parts.push({ kind: 'text', text: t });
  };
  for (const m of text.matchAll(URL_IN_TEXT)) {
    const start = m.index ?? 0;
    const raw = m[0].replace(TRAILING, '');
    pushText(text.slice(last, start));
    last = start + raw.length;
    let url: URL | null = null;
    try {
      url = new URL(raw);
    } catch {
      url = null;
    }
    if (url && origin && (url.protocol === 'http:' || url.protocol === 'https:') && url.origin === origin) {
      parts.push({ kind: 'link', text: raw, href: `${url.pathname}${url.search}${url.hash}` });
    } else {
      pushText(raw);
    }
  }
  pushText(text.slice(last));
  return parts;
}
