import { existsSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import Mustache from 'mustache';
import type { Channel, MessageTemplate } from '@shared/schemas/messages';

const DIR = fileURLToPath(new URL('./templates/', import.meta.url));
const cache = new Map<string, string | null>();

function load(language: string, template: MessageTemplate, channel: Channel): string | null {
  const key = `${language}/${template}.${channel}`;
  if (!cache.has(key)) {
    const file = `${DIR}${language}/${template}.${channel}.mustache`;
    cache.set(key, existsSync(file) ? readFileSync(file, 'utf8') : null);
  }
  return cache.get(key)!;
}

/** 'es-MX' → 'es' → 'en': the most specific language with this template. */
export function templateLanguage(language: string, template: MessageTemplate, channel: Channel): string | null {
  for (const lang of [language, language.split('-')[0], 'en']) if (/^[a-z]{2}(-[A-Z]{2})?$/.test(lang) && load(lang, template, channel)) return lang;
  return null;
}

export function hasTemplate(template: MessageTemplate, channel: Channel): boolean {
  return load('en', template, channel) !== null;
}

// Values never become template text (Mustache does not re-read them), and every value is escaped for where it
// lands: control characters (CR/LF included) become spaces in plain text and in the subject, so no value can
// start a new header line; the HTML part escapes markup.
const plain = (value: unknown) => String(value).replace(/[\p{Cc}\u2028\u2029]+/gu, ' ');
const html = (value: unknown) => Mustache.escape(plain(value));

export interface RenderedMessage {
  language: string;
  subject: string | null;
  text: string;
  html: string | null;
}

export function renderMessage(template: MessageTemplate, channel: Channel, language: string, view: Record<string, unknown>): RenderedMessage {
  const lang = templateLanguage(language, template, channel);
  if (!lang) throw new Error(`No ${channel} template for ${template}`);
  const source = load(lang, template, channel)!;
  if (channel === 'sms') {
    return { language: lang, subject: null, text: Mustache.render(source, view, {}, { escape: plain }).trim(), html: null };
  }
  const match = /^Subject: (.*)\r?\n\r?\n([\s\S]*)$/.exec(source);
  if (!match) throw new Error(`E-mail template ${lang}/${template} must start with a Subject line and a blank line`);
  const [, subjectSource, bodySource] = match;
  const text = Mustache.render(bodySource, view, {}, { escape: plain }).trim();
  const body = Mustache.render(bodySource, view, {}, { escape: html }).trim();
  return {
    language: lang,
    subject: Mustache.render(subjectSource, view, {}, { escape: plain }).trim(),
    text,
    html: `<!doctype html><html><body style="font-family:sans-serif;font-size:16px;line-height:1.5">${body
      .split(/\n{2,}/)
      .map((p) => `<p>${p.replace(/\n/g, '<br>')}</p>`)
      .join('')}</body></html>`,
  };
}
