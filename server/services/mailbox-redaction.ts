// The sign-in and notice links in caught mail are credentials of their recipient: an admin reading the development
// mailbox sees them only in mail addressed to the admin alone (OWASP ASVS 4.0.3 V2.5: recovery secrets reach their
// owner only). Invitation and reset links carry `token=…`; zone notice links are `/n/<copy id>.<secret>`.
const LINK_SECRETS = [/(token=)[A-Za-z0-9_%-]+/g, /(\/n\/)[0-9a-f-]{36}\.[A-Za-z0-9_-]+/g];

export const HIDDEN_LINK = '[link hidden: it works only for the person it was sent to]';

export function hideLinksOfOthers(body: string, recipients: string[], viewerEmail: string) {
  const onlyForViewer = recipients.length > 0 && recipients.every((r) => r.toLowerCase() === viewerEmail.toLowerCase());
  if (onlyForViewer) return body;
  return LINK_SECRETS.reduce((text, pattern) => text.replace(pattern, `$1${HIDDEN_LINK}`), body);
}
