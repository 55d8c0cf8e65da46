// The zone-notice e-mail: composed from the notice's material (HTML and plain text, inline map, GeoJSON
// attachment) and delivered once per copy, with the Message-ID fixed when the copy was queued.
import type Mail from 'nodemailer/lib/mailer';
import {
  claimRecipientForSending,
  failRecipientIfRevoked,
  isRecipientBeingSent,
  markRecipientFailed,
  markRecipientSent,
} from '../queries/notice-recipients.ts';
import { config } from '../config.ts';
import { mailTransport } from '../mail/transport.ts';
import { escapeHtml } from './escape-html.ts';
import { issueNoticeToken } from './notice-links.ts';
import { renderNoticeMap } from './notice-map.ts';
import { organisationHeader } from '../mail/organisation-header.ts';
import { noticeMaterial, type NoticeMaterial } from './notice-material.ts';
import { refreshNoticeStatus } from './notice-sending.ts';
import { MACHINE_FILE_CAUTION } from '../../shared/notices/cautions.ts';
import { fromCornerText, latLonText } from '../../shared/notices/zone-location-words.ts';
import { decisionText, thresholdSourceText, zoneEvidenceText } from '../../shared/notices/notice-words.ts';
import { noticeMachineFilePaths } from './zone-files/zone-machine-files.ts';
import type { NoticeContent } from '../../shared/schemas/notices.ts';
import { DEFAULT_DATE_FORMAT, formatCalendarDate } from '../../shared/dates/format-dates.ts';

export const MAP_CID = 'notice-map@patchwise';
export const PREVIEW_LINK = `${config.publicUrl}/n/(each grower's own link)`;

const ha = (m2: number) => (m2 / 10_000).toFixed(2);
const ac = (m2: number) => (m2 / 4046.8564224).toFixed(2);
const percent = (share: number) => `${(share * 100).toFixed(1)} %`;
// Calendar dates in the organisation's locale, the same function the notice page uses.
const longDate = (c: NoticeContent, isoDay: string) => formatCalendarDate(isoDay, c.dateFormat ?? DEFAULT_DATE_FORMAT);

export const noticeSubject = (c: NoticeContent) => `Treatment zones for ${c.pestName} in ${c.fieldName}, ${c.farmName}`;

function walkDatesText(c: NoticeContent) {
  return c.walkDates.length ? c.walkDates.map((day) => longDate(c, day)).join(', ') : 'no walk recorded';
}

/** The statistics behind the verdict: the full headline (when it carries figures) and the check's figures. */
function figuresBehind(c: NoticeContent) {
  const plain = c.verdict.plain ?? c.verdict.headline;
  return [...(plain === c.verdict.headline ? [] : [c.verdict.headline]), ...c.verdict.figures];
}

export function noticeText(c: NoticeContent, link: string): string {
  const rows = c.zones.map(
    (z) =>
      `  ${z.label}: ${ha(z.areaM2)} ha (${ac(z.areaM2)} ac), ${percent(z.shareOfField)} of the field, ${z.sightingsInside} sighting${z.sightingsInside === 1 ? '' : 's'}` +
      (z.location ? `; centre ${latLonText(z.location.centre)}, ${fromCornerText(z.location)}` : ''),
  );
  const figures = figuresBehind(c);
  return [
    `Zone notice from ${c.organisationName}`,
    `${c.pestName} on ${c.fieldName}, ${c.farmName}`,
    '',
    'THE DECISION',
    decisionText(c),
    '',
    `Recommendation from ${c.adviserName}:`,
    c.recommendation,
    ...(c.rescoutOn ? [`Re-scout on: ${longDate(c, c.rescoutOn)}`] : []),
    '',
    'TREATMENT ZONES',
    ...rows,
    `  Total to treat: ${ha(c.totalTreatedM2)} ha (${ac(c.totalTreatedM2)} ac); ${percent(c.untreatedShare)} of the field is left untreated.`,
    '',
    'BEFORE ANY TREATMENT',
    ...c.cautions.map((caution) => `- ${caution}`),
    '',
    'HOW WE KNOW',
    `Farm: ${c.farmName}. Field: ${c.fieldName} (${ha(c.fieldAreaM2)} ha, ${ac(c.fieldAreaM2)} ac). Pest: ${c.pestName}. Walk dates: ${walkDatesText(c)}.`,
    ...c.zones.map((z) => `- ${zoneEvidenceText(z, c.threshold)}`),
    ...(c.threshold ? [thresholdSourceText(c.threshold)] : []),
    `The check's verdict: ${c.verdict.plain ?? c.verdict.headline}`,
    ...(figures.length ? ['The figures behind it:', ...figures.map((f) => `- ${f}`)] : []),
    '',
    `See the map, the zones and acknowledge this notice: ${link}`,
    'The zones are attached as zones.geojson for a mapping program. Files for a sprayer terminal:',
    `- ISO 11783-10 task data: ${zoneFileLinks(link).taskData}`,
    `- Shapefile: ${zoneFileLinks(link).shapefile}`,
    MACHINE_FILE_CAUTION,
  ].join('\n');
}

/** The zone files beside a notice link: the page at `/n/<token>` has them under the API's link path. */
export function zoneFileLinks(link: string) {
  return noticeMachineFilePaths(link.replace(/\/n\/([^/]+)$/, '/api/notice-links/$1'));
}

export function noticeHtml(c: NoticeContent, link: string, mapSrc = `cid:${MAP_CID}`): string {
  const e = escapeHtml;
  const cell = 'style="padding:4px 8px;border-bottom:1px solid #ebdcb4;text-align:left"';
  const num = 'style="padding:4px 8px;border-bottom:1px solid #ebdcb4;text-align:right"';
  const rows = c.zones
    .map(
      (z) =>
        `<tr><td ${cell}>${e(z.label)}</td><td ${num}>${ha(z.areaM2)}</td><td ${num}>${ac(z.areaM2)}</td><td ${num}>${percent(z.shareOfField)}</td><td ${num}>${z.sightingsInside}</td>` +
        `<td ${cell}>${z.location ? e(latLonText(z.location.centre)) : ''}</td><td ${cell}>${z.location ? e(fromCornerText(z.location)) : ''}</td></tr>`,
    )
    .join('');
  const paragraphs = (text: string) =>
    text
      .split(/\n{2,}/)
      .map((p) => `<p style="margin:0 0 8px">${e(p).replace(/\n/g, '<br>')}</p>`)
      .join('');
  const figures = figuresBehind(c);
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>${e(noticeSubject(c))}</title></head>
<body style="margin:0;padding:16px;background:#fbf8f0;color:#241e19;font-family:'Work Sans',Arial,sans-serif;font-size:15px;line-height:1.45">
<div style="max-width:720px;margin:0 auto">
<h1 style="font-size:20px;color:#2f5d3a;margin:0 0 12px">${e(c.pestName)} treatment zones: ${e(c.fieldName)}, ${e(c.farmName)}</h1>
<div style="background:#ffffff;border:1px solid #ebdcb4;border-left:4px solid #2f5d3a;padding:12px 14px;margin:0 0 14px">
<h2 style="font-size:17px;color:#2f5d3a;margin:0 0 6px">The decision</h2>
<p style="margin:0 0 8px;font-size:16px"><strong>${e(decisionText(c))}</strong></p>
<p style="margin:0 0 4px"><strong>Recommendation from ${e(c.adviserName)}:</strong></p>
${paragraphs(c.recommendation)}
${c.rescoutOn ? `<p style="margin:0"><strong>Re-scout on:</strong> ${e(longDate(c, c.rescoutOn))}</p>` : ''}
</div>
<img src="${e(mapSrc)}" alt="Map of ${e(c.fieldName)} with the treatment zones and sightings" width="640" style="max-width:100%;height:auto;border:1px solid #ebdcb4">
<h2 style="font-size:17px;color:#2f5d3a">Treatment zones</h2>
<table style="border-collapse:collapse;margin-bottom:6px">
<thead><tr><th ${cell}>Zone</th><th ${num}>ha</th><th ${num}>ac</th><th ${num}>Share of field</th><th ${num}>Sightings</th><th ${cell}>Centre (lat, lon)</th><th ${cell}>From the nearest corner</th></tr></thead>
<tbody>${rows}</tbody>
</table>
<p style="margin:0 0 12px">Total to treat: ${ha(c.totalTreatedM2)} ha (${ac(c.totalTreatedM2)} ac); ${percent(c.untreatedShare)} of the field is left untreated.</p>
<h2 style="font-size:17px;color:#9a3f14">Before any treatment</h2>
<ul style="margin:0 0 12px;padding-left:20px">${c.cautions.map((caution) => `<li>${e(caution)}</li>`).join('')}</ul>
<h2 style="font-size:17px;color:#2f5d3a">How we know</h2>
<p style="margin:0 0 6px">Farm ${e(c.farmName)}, field ${e(c.fieldName)} (${ha(c.fieldAreaM2)} ha, ${ac(c.fieldAreaM2)} ac), ${e(c.pestName)}; walked on ${e(walkDatesText(c))}.</p>
<ul style="margin:0 0 6px;padding-left:20px">${c.zones.map((z) => `<li>${e(zoneEvidenceText(z, c.threshold))}</li>`).join('')}</ul>
${c.threshold ? `<p style="margin:0 0 6px;font-size:13px;color:#5f5142">${e(thresholdSourceText(c.threshold))}</p>` : ''}
<p style="margin:0 0 6px">The check’s verdict: <strong>${e(c.verdict.plain ?? c.verdict.headline)}</strong></p>
${figures.length ? `<p style="margin:0 0 2px;font-size:13px;color:#5f5142">The figures behind it:</p><ul style="margin:0 0 12px;padding-left:20px;font-size:13px;color:#5f5142">${figures.map((f) => `<li>${e(f)}</li>`).join('')}</ul>` : ''}
<p style="margin:16px 0"><a href="${e(link)}" style="background:#2f5d3a;color:#ffffff;padding:10px 16px;text-decoration:none;border-radius:4px">Open the notice and acknowledge it</a></p>
<p style="margin:0 0 8px;font-size:13px;color:#5f5142">Files for a sprayer terminal: <a href="${e(zoneFileLinks(link).taskData)}">ISO 11783-10 task data</a> · <a href="${e(zoneFileLinks(link).shapefile)}">shapefile</a>. ${e(MACHINE_FILE_CAUTION)}</p>
<p style="margin:0;font-size:13px;color:#5f5142">Link: ${e(link)}<br>The zones are attached as zones.geojson for a mapping program. Sent by ${e(c.organisationName)}.</p>
</div></body></html>`;
}

/** The message for one copy (or for the preview, with the placeholder link). */
export function composeNoticeMail(material: NoticeMaterial, link: string): { subject: string; html: string; text: string; attachments: Mail.Attachment[] } {
  const map = renderNoticeMap({ boundary: material.boundary, zones: material.zones, sightings: material.sightings });
  return {
    subject: noticeSubject(material.content),
    html: noticeHtml(material.content, link),
    text: noticeText(material.content, link),
    attachments: [
      { filename: 'map.png', content: map, contentType: 'image/png', cid: MAP_CID, contentDisposition: 'inline' },
      { filename: 'zones.geojson', content: JSON.stringify(material.zonesGeoJson, null, 1), contentType: 'application/geo+json' },
    ],
  };
}

/** A copy whose 'sending' mark is older than this is taken to have died mid-send and may be claimed again. */
const STALE_SENDING_MINUTES = 15;

/**
 * Sends one copy of a notice, at most once per SMTP acceptance:
 * 1. claim the copy in one statement (not yet accepted, not revoked, not being sent right now) and count the attempt;
 * 2. issue its link token and compose the message with the Message-ID fixed at queue time;
 * 3. hand it to SMTP; on acceptance record smtp_accepted_at in the very next statement.
 * The one window left: if the process dies after the SMTP server accepts and before that statement commits,
 * the claim goes stale and a later retry sends again — with the same Message-ID, so mail systems that
 * de-duplicate by Message-ID still show one message. Nothing else can send a second copy.
 */
export async function deliverNoticeCopy(recipientId: string): Promise<'sent' | 'skipped'> {
  const claim = await claimRecipientForSending(recipientId, STALE_SENDING_MINUTES);
  if (!claim) {
    await markWithdrawnIfRevoked(recipientId);
    // A fresh claim by another attempt may still die; fail this job so the queue retries it later,
    // instead of completing it and leaving the copy in 'sending' for good.
    if (await isRecipientBeingSent(recipientId)) throw new Error('Another attempt is sending this copy right now; the queue will try again later.');
    return 'skipped';
  }
  try {
    const token = await issueNoticeToken(recipientId);
    const mail = composeNoticeMail(await noticeMaterial(claim.notice_id), `${config.publicUrl}/n/${token}`);
    await mailTransport().sendMail({
      from: config.mailFrom,
      to: { name: claim.contact_name, address: claim.email },
      messageId: claim.message_id,
      ...mail,
      headers: organisationHeader(claim.organisation_id),
    });
    // The single statement after SMTP acceptance (see above).
    await markRecipientSent(recipientId);
  } catch (error) {
    const reason = (error as Error).message || 'The mail server did not accept the message.';
    await markRecipientFailed(recipientId, `Attempt ${claim.attempts}: ${reason}`.slice(0, 1000));
    await refreshNoticeStatus(claim.notice_id);
    throw error;
  }
  await refreshNoticeStatus(claim.notice_id);
  return 'sent';
}

/** A copy withdrawn before it went out is failed with that reason, so the notice's status can settle. */
async function markWithdrawnIfRevoked(recipientId: string) {
  const noticeId = await failRecipientIfRevoked(recipientId);
  if (noticeId) await refreshNoticeStatus(noticeId);
}
