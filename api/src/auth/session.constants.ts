/** Name of the session cookie (httpOnly, SameSite=Lax). */
export const SESSION_COOKIE = 'sixtyfold.sid';
