import { TemporarySendError } from './errors';

/**
 * Asks the mail service whether it accepted a message: how an e-mail attempt of unknown outcome (the worker died
 * after the server accepted it, a time-out) is settled without sending twice. A deployment plugs its mail
 * service's own message search in here; with none configured an uncertain e-mail is held for a coordinator.
 */
export interface MailSearch {
  /** The provider's id of an accepted message with this Message-ID received since a moment, or null. Throws when it cannot tell. */
  findSent(messageId: string, since: Date): Promise<{ providerId: string } | null>;
}

/** The search the local fake offers (`GET /search?messageId=&since=`), the shape a hosted search adapter returns. */
export function createHttpMailSearch(baseUrl: string, opts: { timeoutMs?: number } = {}): MailSearch {
  const base = baseUrl.replace(/\/+$/, '');
  return {
    async findSent(messageId, since) {
      // A clock a little apart between us and the provider must not hide the message.
      const from = new Date(since.getTime() - 60_000).toISOString();
      const url = `${base}/search?${new URLSearchParams({ messageId, since: from })}`;
      let res: Response;
      try {
        res = await fetch(url, { signal: AbortSignal.timeout(opts.timeoutMs ?? 10_000) });
      } catch (err) {
        throw new TemporarySendError(`Mail search unreachable: ${err instanceof Error ? err.message : String(err)}`, { cause: err });
      }
      if (!res.ok) throw new TemporarySendError(`Mail search answered ${res.status}`, { providerCode: res.status });
      const body = (await res.json()) as { messages?: unknown[] };
      // The provider id of an e-mail is its Message-ID, as the sender records it.
      return body.messages?.length ? { providerId: messageId } : null;
    },
  };
}

export function createMailSearch(url: string, opts: { timeoutMs?: number } = {}): MailSearch | null {
  return url ? createHttpMailSearch(url, opts) : null;
}
