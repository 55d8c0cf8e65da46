// The pages an attention line opens: one place, so the server's lines and the client's routes agree.

/** The field's review, on one pest and, when given, one stored check. */
export function reviewPath(fieldId: string, pestId?: string, checkId?: string | null): string {
  const search = new URLSearchParams();
  if (pestId) search.set('pest', pestId);
  if (checkId) search.set('check', checkId);
  const text = search.toString();
  return `/fields/${fieldId}/review${text ? `?${text}` : ''}`;
}

/** The field's review on a pest, a date window and a stored check, each when given (the field page's links). */
export function reviewWindowPath(fieldId: string, params: { pest?: string; from?: string | null; to?: string | null; check?: string } = {}): string {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) if (value) search.set(key, value);
  const text = search.toString();
  return `/fields/${fieldId}/review${text ? `?${text}` : ''}`;
}

/** The zone editor on a check's zones, opened on one stored zone set when given. */
export function zoneEditorPath(fieldId: string, checkId: string | null, zoneSetId?: string | null): string {
  const search = new URLSearchParams();
  if (checkId) search.set('checkId', checkId);
  if (zoneSetId) search.set('zoneSet', zoneSetId);
  const text = search.toString();
  return `/fields/${fieldId}/zones${text ? `?${text}` : ''}`;
}

/** The adviser's page of one notice (its recipients, its grower questions and their answers). */
export function noticePath(noticeId: string): string {
  return `/notices/${noticeId}`;
}
