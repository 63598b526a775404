import { subject } from '@casl/ability';
import { rulesToAST } from '@casl/ability/extra';
import type { AppAbility, Action, SubjectName } from '@shared/auth/ability';

export interface SqlFilter {
  sql: string;
  params: Record<string, unknown>;
}

interface Node {
  operator: string;
  field?: string;
  value: unknown;
}

/**
 * Turns the caller's CASL rules for (action, subject) into a parameterised SQL condition, so list and detail
 * queries can only ever read rows the ability allows. `columns` maps each rule field to a SQL column; a rule on
 * an unmapped field is a programming error and throws rather than silently widening access.
 */
export function accessibleWhere(
  ability: AppAbility,
  action: Action,
  subject: SubjectName,
  columns: Record<string, string>,
  paramPrefix = 'acl',
): SqlFilter {
  const ast = rulesToAST(ability, action, subject) as Node | null;
  if (ast === null) return { sql: '1=0', params: {} };
  const params: Record<string, unknown> = {};
  let n = 0;
  const param = (value: unknown) => {
    const name = `${paramPrefix}${n++}`;
    params[name] = value;
    return `:${name}`;
  };
  const column = (field: string) => {
    const col = columns[field];
    if (!col) throw new Error(`No SQL column mapped for ability field "${field}" on ${subject}`);
    return col;
  };
  const build = (node: Node): string => {
    const list = node.value as Node[];
    switch (node.operator) {
      case 'and':
        return list.length === 0 ? '1=1' : `(${list.map(build).join(' AND ')})`;
      case 'or':
        return list.length === 0 ? '1=0' : `(${list.map(build).join(' OR ')})`;
      case 'not':
        return `NOT (${list.map(build).join(' AND ')})`;
      case 'eq':
        return node.value === null ? `${column(node.field!)} IS NULL` : `${column(node.field!)} = ${param(node.value)}`;
      case 'ne':
        return node.value === null ? `${column(node.field!)} IS NOT NULL` : `${column(node.field!)} <> ${param(node.value)}`;
      case 'in':
        return (node.value as unknown[]).length ? `${column(node.field!)} IN (:...${param(node.value).slice(1)})` : '1=0';
      case 'nin':
        return (node.value as unknown[]).length ? `${column(node.field!)} NOT IN (:...${param(node.value).slice(1)})` : '1=1';
      case 'lt':
        return `${column(node.field!)} < ${param(node.value)}`;
      case 'lte':
        return `${column(node.field!)} <= ${param(node.value)}`;
      case 'gt':
        return `${column(node.field!)} > ${param(node.value)}`;
      case 'gte':
        return `${column(node.field!)} >= ${param(node.value)}`;
      default:
        throw new Error(`Unsupported ability operator "${node.operator}"`);
    }
  };
  return { sql: build(ast), params };
}

const NO_ONE = '00000000-0000-0000-0000-000000000000';

/**
 * Whether the caller may read every baby of a programme, whoever its nurse and whichever baby: asked of the rules
 * with a baby no rule names by nurse or by id, so only a rule on the programme alone can allow it.
 */
export function readsEveryInfantOf(ability: AppAbility, programmeId: string): boolean {
  return ability.can('read', subject('Infant', { programmeId, nurseId: NO_ONE, id: NO_ONE } as Record<string, unknown>));
}
