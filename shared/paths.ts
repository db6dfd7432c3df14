/**
 * Every client URL in one place: `path` is the router pattern, `getHref` builds a link. The
 * client's router and links use it (src/config/paths.ts), and so does the server wherever it
 * writes a link into the app: mails, notices, the calendar feed, the digest, the public page.
 */

function withNext(base: string, next?: string | null): string {
  return next && next !== '/' ? `${base}?next=${encodeURIComponent(next)}` : base;
}

/** A page of one build, e.g. /builds/:buildId/parts. */
function section(name: string) {
  return {
    path: `/builds/:buildId/${name}`,
    getHref: (buildId: string) => `/builds/${encodeURIComponent(buildId)}/${name}`,
  };
}

export const paths = {
  home: { path: '/', getHref: () => '/' },
  auth: {
    signIn: { path: '/sign-in', getHref: (next?: string | null) => withNext('/sign-in', next) },
    signUp: { path: '/sign-up', getHref: (next?: string | null) => withNext('/sign-up', next) },
    forgotPassword: { path: '/forgot-password', getHref: () => '/forgot-password' },
    resetPassword: {
      path: '/reset-password/:token',
      getHref: (token: string) => `/reset-password/${encodeURIComponent(token)}`,
    },
    invite: {
      path: '/invite/:token',
      getHref: (token: string) => `/invite/${encodeURIComponent(token)}`,
    },
    confirmEmail: {
      path: '/confirm-email/:token',
      getHref: (token: string) => `/confirm-email/${encodeURIComponent(token)}`,
    },
  },
  account: { path: '/account', getHref: () => '/account' },
  /** A build's public page and its printable sheet: no sign-in needed. */
  shared: {
    page: {
      path: '/shared/:token',
      getHref: (token: string) => `/shared/${encodeURIComponent(token)}`,
    },
    sheet: {
      path: '/shared/:token/sheet',
      getHref: (token: string) => `/shared/${encodeURIComponent(token)}/sheet`,
    },
  },
  builds: {
    list: { path: '/builds', getHref: () => '/builds' },
    new: { path: '/builds/new', getHref: () => '/builds/new' },
    overview: {
      path: '/builds/:buildId',
      getHref: (buildId: string) => `/builds/${encodeURIComponent(buildId)}`,
    },
    edit: {
      path: '/builds/:buildId/edit',
      getHref: (buildId: string) => `/builds/${encodeURIComponent(buildId)}/edit`,
    },
    parts: section('parts'),
    /** The ledger with one part opened (the owner's edit form) or picked out (everyone else). */
    part: {
      path: '/builds/:buildId/parts',
      getHref: (buildId: string, partId: string) =>
        `/builds/${encodeURIComponent(buildId)}/parts?part=${encodeURIComponent(partId)}`,
    },
    timeline: section('timeline'),
    budget: section('budget'),
    sendOuts: section('send-outs'),
    estimate: section('estimate'),
    install: section('install'),
    step: {
      path: '/builds/:buildId/install/steps/:stepId',
      getHref: (buildId: string, stepId: string) =>
        `/builds/${encodeURIComponent(buildId)}/install/steps/${encodeURIComponent(stepId)}`,
    },
    photos: section('photos'),
    notices: section('notices'),
    bench: section('bench'),
    benchNew: {
      path: '/builds/:buildId/bench/new',
      getHref: (buildId: string, partId?: string) =>
        `/builds/${encodeURIComponent(buildId)}/bench/new${partId ? `?partId=${encodeURIComponent(partId)}` : ''}`,
    },
    benchSheet: {
      path: '/builds/:buildId/bench/sheets/:sheetId',
      getHref: (buildId: string, sheetId: string) =>
        `/builds/${encodeURIComponent(buildId)}/bench/sheets/${encodeURIComponent(sheetId)}`,
    },
    benchEdit: {
      path: '/builds/:buildId/bench/sheets/:sheetId/edit',
      getHref: (buildId: string, sheetId: string) =>
        `/builds/${encodeURIComponent(buildId)}/bench/sheets/${encodeURIComponent(sheetId)}/edit`,
    },
    benchCompare: {
      path: '/builds/:buildId/bench/compare',
      getHref: (buildId: string, before?: string, after?: string) => {
        const q = new URLSearchParams();
        if (before) q.set('before', before);
        if (after) q.set('after', after);
        const query = q.toString();
        return `/builds/${encodeURIComponent(buildId)}/bench/compare${query ? `?${query}` : ''}`;
      },
    },
    dyno: section('dyno'),
    /** The owner's sharing settings: the public page's switch, what it shows, its photos. */
    share: section('share'),
    /** The printable build sheet (its own layout, for paper). */
    sheet: {
      path: '/builds/:buildId/sheet',
      getHref: (buildId: string, money = false) =>
        `/builds/${encodeURIComponent(buildId)}/sheet${money ? '?money=1' : ''}`,
    },
    dynoSession: {
      path: '/builds/:buildId/dyno/:sessionId',
      getHref: (buildId: string, sessionId: string, search = '') =>
        `/builds/${encodeURIComponent(buildId)}/dyno/${encodeURIComponent(sessionId)}${search}`,
    },
  },
} as const;
