import { withAuth } from 'next-auth/middleware';

// Pages need a session; the API authenticates itself (sessions or bearer tokens) in lib/http/handler.
// Role checks happen again on the server for every page and route: this is only the first gate.
export default withAuth({ pages: { signIn: '/sign-in' } });

export const config = {
  matcher: ['/((?!api/|_next/|sign-in|icon.svg|favicon.ico).*)'],
};
