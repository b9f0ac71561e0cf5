// A local stand-in for the company's OpenID Connect provider (oidc-provider) on 127.0.0.1:$OIDC_PORT, with an
// invented company directory in $OIDC_DIRECTORY (JSON, read at every sign-in, so a test or a person can move
// someone between groups while it runs). Its login page takes the directory login (e.g. hanna.marlow) and any password.
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import Provider from 'oidc-provider';

export interface DirectoryUser { login: string; email: string; name: string; groups: string[] }

const port = Number(process.env.OIDC_PORT ?? 4700);
const issuer = `http://127.0.0.1:${port}`;
const directoryFile = process.env.OIDC_DIRECTORY ?? join(process.cwd(), '.data', 'oidc-directory.json');
const redirects = (process.env.OIDC_REDIRECT_URIS ?? 'http://localhost:3000/api/auth/callback/company,http://127.0.0.1:3000/api/auth/callback/company')
  .split(',').map((s) => s.trim()).filter(Boolean);

/** The invented company directory: Brightwater Thermal Systems' people and their groups. */
export const DEMO_DIRECTORY: DirectoryUser[] = [
  { login: 'hanna.marlow', email: 'hanna.marlow@brightwater.example', name: 'Hanna Marlow', groups: ['thermal-approvers', 'thermal-engineers'] },
  { login: 'oskar.lind', email: 'oskar.lind@brightwater.example', name: 'Oskar Lind', groups: ['thermal-methods', 'thermal-engineers'] },
  { login: 'priya.natarajan', email: 'priya.natarajan@brightwater.example', name: 'Priya Natarajan', groups: ['thermal-engineers'] },
  { login: 'tomas.reyes', email: 'tomas.reyes@brightwater.example', name: 'Tomas Reyes', groups: ['sales'] },
];

function directory(): DirectoryUser[] {
  if (!existsSync(directoryFile)) {
    mkdirSync(dirname(directoryFile), { recursive: true });
    writeFileSync(directoryFile, JSON.stringify(DEMO_DIRECTORY, null, 2));
  }
  return JSON.parse(readFileSync(directoryFile, 'utf8')) as DirectoryUser[];
}

const provider = new Provider(issuer, {
  clients: [{
    client_id: process.env.OIDC_CLIENT_ID ?? 'correlary',
    client_secret: process.env.OIDC_CLIENT_SECRET ?? 'correlary-demo-oidc-secret',
    redirect_uris: redirects,
    grant_types: ['authorization_code'], response_types: ['code'],
    token_endpoint_auth_method: 'client_secret_basic',
  }],
  async findAccount(_ctx, id) {
    const u = directory().find((x) => x.login === id || x.email === id);
    if (!u) return undefined;
    return { accountId: u.login, claims: async () => ({ sub: u.login, email: u.email, email_verified: true, name: u.name, groups: u.groups }) };
  },
  claims: { openid: ['sub'], email: ['email', 'email_verified'], profile: ['name'], groups: ['groups'] },
  scopes: ['openid', 'email', 'profile', 'groups'],
  // The relying party reads the claims from the ID token (no userinfo round trip).
  conformIdTokenClaims: false,
  features: { devInteractions: { enabled: true } },
  cookies: { keys: [process.env.OIDC_COOKIE_KEY ?? 'fake-oidc-cookie-key-for-the-demo-only'] },
  pkce: { required: () => true },
  ttl: { Session: 8 * 3600, Interaction: 600, AuthorizationCode: 60, IdToken: 600, AccessToken: 600, Grant: 8 * 3600 },
});
// The stand-in's built-in pages import a web font from the internet; nothing may be fetched from outside, so the
// import is taken out of every page it serves (the pages fall back to the browser's sans-serif).
provider.use(async (ctx, next) => {
  await next();
  if (typeof ctx.body === 'string' && /html/.test(ctx.type)) ctx.body = ctx.body.replace(/@import url\(https?:\/\/[^)]*\);?/g, '');
});
provider.listen(port, '127.0.0.1');
console.log(`Fake OpenID provider on ${issuer}; directory ${directoryFile}; redirect URIs ${redirects.join(' ')}`);
