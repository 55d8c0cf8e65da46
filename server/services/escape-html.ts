const replacements: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/** Escapes text for HTML e-mail bodies, which React cannot escape for us. */
export const escapeHtml = (text: string) => text.replace(/[&<>"']/g, (c) => replacements[c]);
