// What production refuses: the development defaults that point the senders at the local fakes, and the public
// SMS auth token (with it anyone could sign a forged "STOP" and withdraw a family's consent).
export const DEFAULT_SMS_ACCOUNT_SID = 'AC00000000000000000000000000000000';
export const DEFAULT_SMS_AUTH_TOKEN = 'nestflow-fake-sms-auth-token';
const DEFAULT_SMTP_FAKE_PORT = 2526;

interface Checked {
  SESSION_SECRET?: string;
  SUPPLIER_LINK_SECRET?: string;
  SMTP_HOST: string;
  SMTP_PORT?: number;
  FAKE_SMTP_PORT: number;
  TWILIO_ACCOUNT_SID: string;
  TWILIO_AUTH_TOKEN: string;
  SMS_API_BASE?: string;
  MAIL_SEARCH_URL?: string;
}

const LOOPBACK = /^(localhost|127(\.\d{1,3}){3}|\[?::1\]?|0\.0\.0\.0)$/i;
const isLoopbackHost = (host: string) => LOOPBACK.test(host.trim());
const isLoopbackUrl = (url: string) => {
  try {
    return isLoopbackHost(new URL(url).hostname);
  } catch {
    return false;
  }
};

/** One line per variable that is missing or still a local/demo value; empty when production may start. */
export function productionProblems(source: NodeJS.ProcessEnv, env: Checked): string[] {
  const problems: string[] = [];
  if (!env.SESSION_SECRET) problems.push('SESSION_SECRET: is required in production (32+ characters)');
  if (!env.SUPPLIER_LINK_SECRET) problems.push('SUPPLIER_LINK_SECRET: is required in production (32+ characters; signs the supplier\'s order links)');
  const given = (name: string) => typeof source[name] === 'string' && source[name]!.trim() !== '';
  const need = (name: string, what: string) => {
    if (!given(name)) problems.push(`${name}: is required in production (${what})`);
    return given(name);
  };

  if (need('SMTP_HOST', 'the real mail service') && isLoopbackHost(env.SMTP_HOST)) {
    const port = env.SMTP_PORT ?? env.FAKE_SMTP_PORT;
    if (!env.SMTP_PORT || port === env.FAKE_SMTP_PORT || port === DEFAULT_SMTP_FAKE_PORT) {
      problems.push(`SMTP_HOST: points at the local fake mail server (${env.SMTP_HOST}:${port}); give the real mail service`);
    }
  }
  need('MAIL_FROM', 'a sender address of your own domain');
  if (need('TWILIO_ACCOUNT_SID', 'the SMS account') && env.TWILIO_ACCOUNT_SID === DEFAULT_SMS_ACCOUNT_SID) {
    problems.push('TWILIO_ACCOUNT_SID: is the placeholder account; give the real one');
  }
  if (need('TWILIO_AUTH_TOKEN', 'the SMS account secret') && env.TWILIO_AUTH_TOKEN === DEFAULT_SMS_AUTH_TOKEN) {
    problems.push('TWILIO_AUTH_TOKEN: is the public development token; anyone could sign SMS replies with it');
  }
  need('TWILIO_FROM', 'the SMS sending number');
  if (env.SMS_API_BASE && isLoopbackUrl(env.SMS_API_BASE)) {
    problems.push('SMS_API_BASE: points at a loopback address (the local fake SMS server); leave it unset for the hosted service');
  }
  if (env.MAIL_SEARCH_URL && isLoopbackUrl(env.MAIL_SEARCH_URL)) {
    problems.push('MAIL_SEARCH_URL: points at a loopback address (the local fake mail server); give the mail service search or leave it unset');
  }
  return problems;
}
