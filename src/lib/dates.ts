/**
 * Dates as pages show them (en-GB: "2 Dec 2026", "2 Dec 2026, 14:05"). The formatters are
 * made once per process: constructing an Intl.DateTimeFormat costs more than a page's
 * other formatting together.
 */
const DATE = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });
const DATE_TIME = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' });

/** "2 Dec 2026". */
export const formatDate = (when: Date): string => DATE.format(when);

/** "2 Dec 2026, 14:05" (server time zone). */
export const formatDateTime = (when: Date): string => DATE_TIME.format(when);
