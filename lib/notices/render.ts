import Mustache from 'mustache';

/**
 * Fills a notice template (mustache: logic-less, values HTML-escaped by default) and returns
 * the subject, a plain-text body and an HTML body. Pure: used by the server, the worker and the
 * template editor's live preview in the browser.
 *
 * Body format: paragraphs separated by a blank line; lines starting with "- " form a list.
 */
export type Rendered = { subject: string; text: string; html: string };

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
const noEscape = (s: unknown) => String(s);

/** Templates may only use escaped tags: "{{{x}}}" and "{{&x}}" would let HTML through. */
export function templateProblem(source: string): string | null {
  if (/\{\{\s*[{&]/.test(source)) return 'Use {{name}} only: {{{name}}} and {{&name}} are not allowed (they would skip escaping).';
  if (/\{\{\s*[>=]/.test(source)) return 'Partials and delimiter changes are not supported in notice templates.';
  try {
    Mustache.parse(source);
  } catch (err) {
    return `The template does not parse: ${(err as Error).message}`;
  }
  return null;
}

function blocksToHtml(escaped: string): string {
  return escaped
    .split(/\n\s*\n/)
    .map((block) => block.trim())
    .filter(Boolean)
    .map((block) => {
      const lines = block.split('\n');
      const firstItem = lines.findIndex((l) => l.startsWith('- '));
      const items = firstItem >= 0 && lines.slice(firstItem).every((l) => l.startsWith('- ')) ? lines.slice(firstItem) : [];
      const lead = items.length ? lines.slice(0, firstItem) : lines;
      const p = lead.length ? `<p>${lead.join('<br>\n')}</p>` : '';
      const ul = items.length ? `<ul>${items.map((l) => `<li>${l.slice(2)}</li>`).join('')}</ul>` : '';
      return p + ul;
    })
    .join('\n');
}

export function renderNotice(tpl: { subject: string; body: string }, values: Record<string, string | undefined>): Rendered {
  const view = { ...values };
  const subject = Mustache.render(tpl.subject, view, {}, { escape: noEscape }).replace(/\s+/g, ' ').trim();
  const text = Mustache.render(tpl.body, view, {}, { escape: noEscape }).replace(/\n{3,}/g, '\n\n').trim() + '\n';
  let html = blocksToHtml(Mustache.render(escapeHtml(tpl.body), view, {}, { escape: escapeHtml }));
  const link = values.responseLink;
  if (link) {
    const l = escapeHtml(link);
    html = html.split(l).join(`<a href="${l}">${l}</a>`);
  }
  return { subject, text, html };
}

/** The HTML e-mail around a rendered body: plain, readable, no images or tracking. */
export function wrapHtml(bodyHtml: string, clubName: string): string {
  return `<!doctype html><html><body style="font-family:Arial,Helvetica,sans-serif;font-size:16px;line-height:1.5;color:#1c2a36;max-width:640px;margin:0 auto;padding:16px">
<p style="font-weight:bold;color:#0f5e66">${escapeHtml(clubName)}</p>
${bodyHtml}
</body></html>`;
}
