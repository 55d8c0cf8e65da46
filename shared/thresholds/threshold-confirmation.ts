// The words every screen, e-mail and print uses for a threshold the admin has not yet checked against its
// published source: it is never shown as if it were sourced.

export const NEEDS_CONFIRMING = 'Needs confirming';

/** For advisers, scouts and admins, beside the threshold. */
export const unconfirmedThresholdSentence =
  'This threshold has not yet been checked against a published source: read it as a starting point, not as sourced guidance, until an admin confirms it in the pest library.';

/** For the grower, in the notice's "How we know". */
export const unconfirmedThresholdNoticeSentence =
  'This threshold has not yet been checked against a published source; ask your adviser or local extension service before relying on it.';
