import 'express-serve-static-core';
import 'express-session';
import type { Caller } from './auth/auth.service';

declare module 'express-session' {
  interface SessionData {
    csrfToken: string;
    userId: number;
    teamId: number;
    /** Sign-in time [ms since epoch]; the absolute timeout counts from here. */
    signedInAt: number;
  }
}

declare module 'express-serve-static-core' {
  interface Request {
    id: string;
    /** Set by the session loader when the caller is signed in and still a member of the team. */
    auth?: Caller;
  }
}
