import fs from 'node:fs';
import path from 'node:path';
import { caseloadRequestFor } from '@shared/http/caseload-request';

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
 * API requests a page address makes as soon as its code runs, when they can be known from the address alone. Named
 * in the page, they travel beside the page's code on a slow line instead of after it (the caseload: about one round
 * trip sooner on a phone).
 */
const DATA_PRELOADS: Array<{ route: string; requests: (params: URLSearchParams) => Array<string | null> }> = [
  { route: 'caseload', requests: (params) => [caseloadRequestFor(params)] },
];

/**
 * The app's page for any address, with what that address will ask for named in its head so a slow phone line
 * fetches it beside the entry instead of after it: the session (every page asks for it first; `crossorigin` makes
 * the preload same-origin CORS with cookies, the mode and credentials of the API client's fetch, so the browser
 * hands the page this response) and the page's own chunks (`modulepreload`, same origin, so the CSP's
 * `script-src 'self'` covers them). Built once at start; a build without route-preloads.json gets the session only.
 * With a session cookie, a page whose data requests are known from its address (DATA_PRELOADS) names them too.
 */
export function spaPages(webDist: string): (pathname: string, params?: URLSearchParams, signedIn?: boolean) => string {
  const html = fs.readFileSync(path.join(webDist, 'index.html'), 'utf8');
  const manifestFile = path.join(webDist, 'route-preloads.json');
  const preloads: RoutePreloads = fs.existsSync(manifestFile)
    ? JSON.parse(fs.readFileSync(manifestFile, 'utf8'))
    : { always: [], routes: [] };
  const fetchPreload = (href: string) => `<link rel="preload" href="${escapeAttr(href)}" as="fetch" crossorigin>`;
  const session = fetchPreload('/api/session');
  const modules = (files: string[]) => files.map((f) => `<link rel="modulepreload" crossorigin href="${escapeAttr(f)}">`);
  const render = (files: string[]) => {
    // The session first: the longest wait on the way to a page is its answer, and it is tiny.
    const withSession = html.replace('<title>', `${session}\n    <title>`);
    return withSession.replace('</head>', `${modules([...preloads.always, ...files]).map((t) => `  ${t}\n  `).join('')}</head>`);
  };
  const plain = render([]);
  const pages = preloads.routes.map((r) => ({ pattern: routePattern(r.path), html: render(r.files) }));
  const data = DATA_PRELOADS.map((d) => ({ pattern: routePattern(d.route), requests: d.requests }));
  return (pathname, params = new URLSearchParams(), signedIn = false) => {
    const html = pages.find((p) => p.pattern.test(pathname))?.html ?? plain;
    const requests = signedIn ? (data.find((d) => d.pattern.test(pathname))?.requests(params) ?? []) : [];
    const links = requests.filter((r): r is string => !!r).map(fetchPreload);
    // Right after the session's, which every page asks for first.
    return links.length ? html.replace(session, [session, ...links].join('\n    ')) : html;
  };
}
