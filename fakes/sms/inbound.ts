import twilio from 'twilio';

export interface InboundForwarding {
  inboundWebhookUrl?: string;
  accountSid: string;
  authToken: string;
  /** Our sending number: an inbound reply is addressed to it. */
  ourNumber: string;
}

export type InboundResult =
  | { ok: true; messageSid: string; forwarded: false }
  | { ok: true; messageSid: string; forwarded: true; webhookStatus: number }
  | { ok: false; messageSid: string; forwarded: false; error: string };

export async function forwardInbound(
  config: InboundForwarding,
  message: { from: string; body: string; messageSid: string },
): Promise<InboundResult> {
  const { messageSid } = message;
  if (!config.inboundWebhookUrl) return { ok: true, messageSid, forwarded: false };
  const params = {
    From: message.from,
    To: config.ourNumber,
    Body: message.body,
    MessageSid: messageSid,
    AccountSid: config.accountSid,
  };
  // Signed the way the hosted service signs, so our webhook can verify it with the SDK's validateRequest.
  const signature = twilio.getExpectedTwilioSignature(config.authToken, config.inboundWebhookUrl, params);
  try {
    const res = await fetch(config.inboundWebhookUrl, {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded', 'x-twilio-signature': signature },
      body: new URLSearchParams(params),
      signal: AbortSignal.timeout(5_000),
    });
    await res.arrayBuffer();
    return res.ok
      ? { ok: true, messageSid, forwarded: true, webhookStatus: res.status }
      : { ok: false, messageSid, forwarded: false, error: `webhook answered ${res.status}` };
  } catch (err) {
    return { ok: false, messageSid, forwarded: false, error: err instanceof Error ? err.message : String(err) };
  }
}
