import { vi } from 'vitest';
import type { DataSource } from 'typeorm';
import { poolOf } from '../../server/db/repositories/prepared';

export interface PlanNode { 'Node Type': string; 'Relation Name'?: string; 'Index Name'?: string; Plans?: PlanNode[] }

/**
 * Runs `request` (an API call that lists something), catches the capped count it sends to PostgreSQL and returns the
 * nodes of that statement's plan, with the request's own answer.
 */
export async function countPlanOf<T>(ds: DataSource, request: () => Promise<T>): Promise<{ answer: T; nodes: PlanNode[] }> {
  const spy = vi.spyOn(poolOf(ds), 'query');
  let answer: T;
  let countCall: { text: string; values: unknown[] } | undefined;
  try {
    answer = await request();
    countCall = spy.mock.calls.map(([c]) => c as unknown as { text: string; values: unknown[] }).find((c) => /^SELECT count\(\*\)/.test(c?.text ?? ''));
  } finally {
    spy.mockRestore();
  }
  if (!countCall) throw new Error('the request sent no count');
  const [{ 'QUERY PLAN': plan }] = await ds.query(`EXPLAIN (FORMAT JSON) ${countCall.text}`, countCall.values);
  const nodes: PlanNode[] = [];
  const visit = (n: PlanNode) => { nodes.push(n); (n.Plans ?? []).forEach(visit); };
  visit(plan[0].Plan);
  return { answer, nodes };
}
