// Every rate limit of the app in one table: bucket name, attempts per window and the window, with the reason for the size.
// Sizes are common practice for interactive web apps (generous for people, tight for scripts), not measured values.

export interface RateLimit {
  bucket: string;
  limit: number;
  windowSeconds: number;
}

const MINUTE = 60;
const DAY = 86_400;

/** Wrong passwords per account: 20 per 15 minutes (the 21st is refused); successful sign-ins are not counted. */
export const PASSWORD_PER_ACCOUNT: RateLimit = { bucket: 'password-account', limit: 20, windowSeconds: 15 * MINUTE };
/** Wrong passwords per client address (all accounts together): 300 per 15 minutes. */
export const PASSWORD_PER_CLIENT: RateLimit = { bucket: 'password-client', limit: 300, windowSeconds: 15 * MINUTE };
/** Sign-in link requests per e-mail address: 5 per 15 minutes (each one may send a mail). */
export const SIGN_IN_LINK_PER_ADDRESS: RateLimit = { bucket: 'sign-in-link-address', limit: 5, windowSeconds: 15 * MINUTE };
/** Sign-in link requests per client address: 100 per 15 minutes. */
export const SIGN_IN_LINK_PER_CLIENT: RateLimit = { bucket: 'sign-in-link-client', limit: 100, windowSeconds: 15 * MINUTE };
/** Invitations sent per manuscript: 50 per day (each one sends a mail to an address of the inviter's choice). */
export const INVITATIONS_PER_MANUSCRIPT: RateLimit = { bucket: 'invitation-manuscript', limit: 50, windowSeconds: DAY };
