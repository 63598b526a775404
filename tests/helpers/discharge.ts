import { DEFAULT_DISCHARGE_RULES } from '@shared/schemas/discharge-policy';
import type { Agent } from './agents';

export const put = (a: Agent, path: string, body: unknown) => a.put(path).set('X-CSRF-Token', a.csrf).send(body as object);

/** The evidence a default item asks for, filled in. */
export const evidenceFor = (key: string) => {
  const rule = DEFAULT_DISCHARGE_RULES.items.find((r) => r.key === key)!;
  return Object.fromEntries(rule.evidence.map((k) => [k, k === 'date' ? '2026-11-28' : 'Nurse Tamsin Reed']));
};

/** Ticks every default item but those named, as the coordinator would one by one. */
export async function tickAll(agent: Agent, infantId: string, except: readonly string[] = []) {
  for (const { key } of DEFAULT_DISCHARGE_RULES.items) {
    if (except.includes(key)) continue;
    const res = await put(agent, `/api/infants/${infantId}/discharge/items/${key}`, { done: true, evidence: evidenceFor(key) });
    if (res.status !== 200) throw new Error(`ticking ${key}: ${res.status} ${JSON.stringify(res.body)}`);
  }
}
