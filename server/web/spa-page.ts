import fs from 'node:fs';
import path from 'node:path';

/** route-preloads.json, written by the web build (scripts/build/vite-route-preloads.ts). */
interface RoutePreloads {
  always: string[];
  routes: { path: string; files: string[] }[];
}

const escapeAttr = (value: string) => value.replace(/&/g, '&amp;').replace(/"/g, '&quot;').replace(/</g, '&lt;');

/** `infants/:id` → a pattern for the whole path, one segment per parameter, as React Router matches it. */
function routePattern(route: string): RegExp {
  const segments = route.split('/').map((s) => (s.startsWith(':') ? '[^/]+' : s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')));
  return new RegExp(`^/${segments.join('/')}/?$`);
}

/**
 * The app's page for any address, with what that address will ask for named in its head so a slow phone line
 * fetches it beside the entry instead of after it: the session (every page asks for it first; `crossorigin` makes
 * the preload same-origin CORS with cookies, the mode and credentials of the API client's fetch, so the browser
 * hands the page this response) and the page's own chunks (`modulepreload`, same origin, so the CSP's
 * `script-src 'self'` covers them). Built once at start; a build without route-preloads.json gets the session only.
 */
export function spaPages(webDist: string): (pathname: string) => string {
  const html = fs.readFileSync(path.join(webDist, 'index.html'), 'utf8');
  const manifestFile = path.join(webDist, 'route-preloads.json');
  const preloads: RoutePreloads = fs.existsSync(manifestFile)
    ? JSON.parse(fs.readFileSync(manifestFile, 'utf8'))
    : { always: [], routes: [] };
  const session = '<link rel="preload" href="/api/session" as="fetch" crossorigin>';
  const modules = (files: string[]) => files.map((f) => `<link rel="modulepreload" crossorigin href="${escapeAttr(f)}">`);
  const render = (files: string[]) => {
    // The session first: the longest wait on the way to a page is its answer, and it is tiny.
    const withSession = html.replace('<title>', `${session}\n    <title>`);
    return withSession.replace('</head>', `${modules([...preloads.always, ...files]).map((t) => `  ${t}\n  `).join('')}</head>`);
  };
  const plain = render([]);
  const pages = preloads.routes.map((r) => ({ pattern: routePattern(r.path), html: render(r.files) }));
  return (pathname) => pages.find((p) => p.pattern.test(pathname))?.html ?? plain;
}
