/**
 * The one layout every message uses: a plain-text body and an HTML body saying the same
 * thing, with the firm's name on top, one link to act on, an optional caution line and a
 * footer saying why the message came. Every value is escaped here, so messages never
 * build HTML themselves.
 */
import { DESIGN_AID_CAUTION } from '../caution';
import { escapeHtml } from '../markdown';
import type { MailMessage } from './outbox';

/** A block of the message body. */
export type MailBlock =
  | { kind: 'paragraph'; text: string }
  /** A quotation of someone's words (return comments, a comment excerpt). */
  | { kind: 'quote'; text: string; attribution?: string };

/** What a message consists of, before rendering. */
export interface MailLayout {
  /** The subject; also the heading of the HTML body. */
  subject: string;
  /** Shown above the heading (a firm's name, or "Sequent" for account mail). */
  masthead: string;
  /** Opening line, e.g. "Hello Helena,"; optional. */
  greeting?: string;
  blocks: readonly MailBlock[];
  action: { label: string; url: string };
  /** Adds {@link DESIGN_AID_CAUTION} (messages about results). */
  caution?: boolean;
  /** Why the reader got this message. */
  footer: string;
}

const COLORS = { paper: '#fbfaf6', ink: '#1c2630', soft: '#4a5661', faint: '#77818a', rule: '#d8d2c2', tailwater: '#1d5c66', caution: '#8a5b12', cautionWash: '#f6eedd' };

/** One line for a subject header: no line breaks, runs of space collapsed. */
export function oneLine(text: string): string {
  return text.replace(/\s+/g, ' ').trim();
}

/** `url` when it is an http(s) URL, else null (never a javascript: or data: link). */
function safeUrl(url: string): string | null {
  try {
    const parsed = new URL(url);
    return parsed.protocol === 'http:' || parsed.protocol === 'https:' ? parsed.href : null;
  } catch {
    return null;
  }
}

/** Plain-text paragraphs keep the writer's line breaks; HTML shows them as <br>. */
function htmlText(text: string): string {
  return escapeHtml(text.trim()).replace(/\r?\n/g, '<br>');
}

function quoteText(text: string): string {
  return text
    .trim()
    .split(/\r?\n/)
    .map((line) => `> ${line}`)
    .join('\n');
}

/** Renders `layout` into a {@link MailMessage}. */
export function renderMail(layout: MailLayout): MailMessage {
  const subject = oneLine(layout.subject);
  const url = safeUrl(layout.action.url);

  const text: string[] = [layout.masthead, '', subject, ''];
  if (layout.greeting) text.push(layout.greeting, '');
  for (const block of layout.blocks) {
    if (block.kind === 'paragraph') text.push(block.text.trim(), '');
    else text.push(...(block.attribution ? [`${block.attribution}:`] : []), quoteText(block.text), '');
  }
  text.push(`${layout.action.label}: ${url ?? layout.action.url}`, '');
  if (layout.caution) text.push(DESIGN_AID_CAUTION, '');
  text.push('--', layout.footer);

  const p = `margin:0 0 14px;font-size:15px;line-height:1.55;color:${COLORS.ink}`;
  const html: string[] = [
    '<!doctype html>',
    `<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width"><title>${escapeHtml(subject)}</title></head>`,
    `<body style="margin:0;padding:24px;background:${COLORS.paper};font-family:'Source Sans 3',Segoe UI,Helvetica,Arial,sans-serif">`,
    `<div style="max-width:560px;margin:0 auto;background:#ffffff;border:1px solid ${COLORS.rule};border-radius:6px;padding:24px">`,
    `<p style="margin:0 0 4px;font-size:13px;letter-spacing:0.04em;text-transform:uppercase;color:${COLORS.tailwater}">${escapeHtml(layout.masthead)}</p>`,
    `<h1 style="margin:0 0 18px;font-family:Merriweather,Georgia,serif;font-size:20px;line-height:1.35;color:${COLORS.ink}">${escapeHtml(subject)}</h1>`,
  ];
  if (layout.greeting) html.push(`<p style="${p}">${escapeHtml(layout.greeting)}</p>`);
  for (const block of layout.blocks) {
    if (block.kind === 'paragraph') html.push(`<p style="${p}">${htmlText(block.text)}</p>`);
    else {
      if (block.attribution) html.push(`<p style="${p};margin-bottom:4px;color:${COLORS.soft}">${escapeHtml(block.attribution)}:</p>`);
      html.push(`<blockquote style="margin:0 0 14px;padding:8px 12px;border-left:3px solid ${COLORS.rule};color:${COLORS.soft};font-size:15px;line-height:1.55">${htmlText(block.text)}</blockquote>`);
    }
  }
  html.push(
    url
      ? `<p style="margin:20px 0"><a href="${escapeHtml(url)}" style="display:inline-block;padding:10px 16px;background:${COLORS.tailwater};color:#ffffff;text-decoration:none;border-radius:4px;font-weight:600">${escapeHtml(layout.action.label)}</a></p>` +
          `<p style="margin:0 0 14px;font-size:13px;color:${COLORS.faint}">Or open this address: <a href="${escapeHtml(url)}" style="color:${COLORS.tailwater}">${escapeHtml(url)}</a></p>`
      : `<p style="${p}">${escapeHtml(layout.action.label)}: ${escapeHtml(layout.action.url)}</p>`,
  );
  if (layout.caution) {
    html.push(`<p style="margin:16px 0 0;padding:10px 12px;background:${COLORS.cautionWash};color:${COLORS.caution};font-size:13px;line-height:1.5;border-radius:4px">${escapeHtml(DESIGN_AID_CAUTION)}</p>`);
  }
  html.push(`<p style="margin:20px 0 0;padding-top:12px;border-top:1px solid ${COLORS.rule};font-size:12px;color:${COLORS.faint}">${escapeHtml(layout.footer)}</p>`, '</div></body></html>');

  return { subject, text: text.join('\n'), html: html.join('\n') };
}
