import ts from 'typescript';

// Reads HAZARDS.md's test references and finds each named test in its file with the TypeScript parser, so a test
// that is renamed, removed or skipped breaks the reference (tests/api/hazard-log.test.ts).

export interface TestReference {
  hazard: string;
  file: string;
  title: string;
  line: number;
}

/** Hazard ids from the table (`| H7 | …`). */
export function hazardIds(markdown: string): string[] {
  return [...markdown.matchAll(/^\| (H\d+) \|/gm)].map((m) => m[1]);
}

/**
 * The references: under a heading `### H<n> …`, each line `` - `tests/<path>` › "<exact title>" `` names one
 * `describe`, `it` or `test` by its title as written (an `it.each` title with its `%s`, a template with its `${…}`).
 */
export function testReferences(markdown: string): TestReference[] {
  const out: TestReference[] = [];
  let hazard: string | null = null;
  for (const [i, line] of markdown.split('\n').entries()) {
    const heading = /^### (H\d+)\b/.exec(line);
    if (heading) hazard = heading[1];
    else if (/^#{1,3} /.test(line)) hazard = null;
    const ref = /^- `([^`]+)` › "(.+)"\s*$/.exec(line);
    if (ref && hazard) out.push({ hazard, file: ref[1], title: ref[2], line: i + 1 });
  }
  return out;
}

export type Found = 'ok' | 'missing' | 'skipped';

const TEST_FUNCTIONS = new Set(['describe', 'it', 'test', 'suite']);
const SKIPPED_FUNCTIONS = new Set(['xdescribe', 'xit', 'xtest']);
// skipIf/runIf depend on the run: a control's test must always run, so these count as skipped too.
const SKIPPING_MODIFIERS = new Set(['skip', 'todo', 'skipIf', 'runIf']);

interface Call { name: string; skipped: boolean; title: string | null; hasBody: boolean }

/** `it`, `it.skip`, `it.each([...])`, `describe.skipIf(x)`: the base name and whether the form skips. */
function readCall(node: ts.CallExpression, source: ts.SourceFile): Call | null {
  let callee: ts.Expression = node.expression;
  const modifiers: string[] = [];
  for (;;) {
    if (ts.isCallExpression(callee)) callee = callee.expression;
    else if (ts.isPropertyAccessExpression(callee)) {
      modifiers.push(callee.name.text);
      callee = callee.expression;
    } else break;
  }
  if (!ts.isIdentifier(callee)) return null;
  const base = callee.text;
  if (!TEST_FUNCTIONS.has(base) && !SKIPPED_FUNCTIONS.has(base)) return null;
  const first = node.arguments[0];
  let title: string | null = null;
  if (first && (ts.isStringLiteral(first) || ts.isNoSubstitutionTemplateLiteral(first))) title = first.text;
  else if (first && ts.isTemplateExpression(first)) title = first.getText(source).slice(1, -1);
  return {
    name: base,
    skipped: SKIPPED_FUNCTIONS.has(base) || modifiers.some((m) => SKIPPING_MODIFIERS.has(m)),
    title,
    hasBody: node.arguments.length > 1,
  };
}

/** Whether a test file has a describe/it/test with exactly this title, and whether it (or a describe around it) is skipped. */
export function findTest(sourceText: string, title: string, fileName = 'test.ts'): Found {
  const source = ts.createSourceFile(fileName, sourceText, ts.ScriptTarget.Latest, true, fileName.endsWith('x') ? ts.ScriptKind.TSX : ts.ScriptKind.TS);
  let result: Found = 'missing';
  const visit = (node: ts.Node, skippedAbove: boolean) => {
    let skipped = skippedAbove;
    if (ts.isCallExpression(node)) {
      const call = readCall(node, source);
      if (call) {
        // A test without a body is a placeholder (`it('…')` is reported as todo).
        skipped = skippedAbove || call.skipped || !call.hasBody;
        if (call.title === title && result !== 'ok') result = skipped ? 'skipped' : 'ok';
      }
    }
    ts.forEachChild(node, (child) => visit(child, skipped));
  };
  visit(source, false);
  return result;
}

/** Every title in a file, for choosing references. */
export function testTitles(sourceText: string, fileName = 'test.ts'): string[] {
  const source = ts.createSourceFile(fileName, sourceText, ts.ScriptTarget.Latest, true, fileName.endsWith('x') ? ts.ScriptKind.TSX : ts.ScriptKind.TS);
  const titles: string[] = [];
  const visit = (node: ts.Node) => {
    if (ts.isCallExpression(node)) {
      const call = readCall(node, source);
      if (call?.title) titles.push(`${call.name}: ${call.title}`);
    }
    ts.forEachChild(node, visit);
  };
  visit(source);
  return titles;
}
