/// <reference types="astro/client" />

declare namespace App {
  interface Locals {
    /** The signed-in user, or null on public pages. */
    user: import('./lib/auth/auth').AuthSession['user'] | null;
    /** The session record, or null. */
    session: import('./lib/auth/auth').AuthSession['session'] | null;
    /** The firm the request acts in and the user's role there, or null. */
    firm: import('./lib/firms').FirmContext | null;
  }
}
