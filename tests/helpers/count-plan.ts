import { vi } from 'vitest';
import pg from 'pg';
import type { DataSource } from 'typeorm';

export interface PlanNode { 'Node Type': string; 'Relation Name'?: string; 'Index Name'?: string; Plans?: PlanNode[] }

/**
 * Runs `request` (an API call that lists something), catches the statement that reads its page and count
 * (list-paging.ts, pageAndCount) and returns the nodes of the count's part of that statement's plan, with the
 * request's own answer.
 */
export async function countPlanOf<T>(ds: DataSource, request: () => Promise<T>): Promise<{ answer: T; nodes: PlanNode[] }> {
  const spy = vi.spyOn(pg.Client.prototype, 'query');
  let answer: T;
  let listCall: { text: string; values: unknown[] } | undefined;
  try {
    answer = await request();
    listCall = spy.mock.calls
      .map(([c, v]) => (typeof c === 'string' ? { text: c, values: v as unknown[] } : (c as unknown as { text: string; values: unknown[] })))
      .find((c) => /^SELECT c\.k_total, page\.\*/.test(c?.text ?? ''));
  } finally {
    spy.mockRestore();
  }
  if (!listCall) throw new Error('the request sent no page with its count');
  const [{ 'QUERY PLAN': plan }] = await ds.query(`EXPLAIN (FORMAT JSON) ${listCall.text}`, listCall.values);
  // The count is the one aggregate of the statement: its subtree is what counting reads.
  const find = (n: PlanNode): PlanNode | undefined => (n['Node Type'] === 'Aggregate' ? n : (n.Plans ?? []).map(find).find(Boolean));
  const count = find(plan[0].Plan);
  if (!count) throw new Error('the statement has no count');
  const nodes: PlanNode[] = [];
  const visit = (n: PlanNode) => { nodes.push(n); (n.Plans ?? []).forEach(visit); };
  visit(count);
  return { answer, nodes };
}
