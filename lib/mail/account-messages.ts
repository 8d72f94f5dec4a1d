const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

function message(opts: { greeting: string; lead: string; link: string; action: string; footer: string }) {
  const text = `${opts.greeting}\n\n${opts.lead}\n\n${opts.action}:\n${opts.link}\n\n${opts.footer}\n\n— Quietfix\n`;
  const html = `<p>${escapeHtml(opts.greeting)}</p><p>${escapeHtml(opts.lead)}</p>
<p><a href="${escapeHtml(opts.link)}">${escapeHtml(opts.action)}</a></p>
<p style="color:#5b6f82">${escapeHtml(opts.footer)}</p><p>— Quietfix</p>`;
  return { text, html };
}

export type AccountMail = { subject: string; text: string; html: string };

/** The invitation e-mail; `link` is the set-password link (or the outbox's stand-in for it). */
export function invitationMail(p: { name: string; clubName: string; inviterName: string; role: string; link: string }): AccountMail {
  const { link } = p;
  return {
    subject: `${p.clubName}: you are invited to Quietfix`,
    ...message({
      greeting: `Hello ${p.name},`,
      lead: `${p.inviterName} has invited you to the ${p.clubName} interference committee's Quietfix workspace as ${p.role}.`,
      action: 'Choose your password',
      link,
      footer: 'The link works once and expires after 72 hours. If you did not expect this, ignore this message.',
    }),
  };
}

export function passwordResetMail(p: { name: string; link: string }): AccountMail {
  const { link } = p;
  return {
    subject: 'Quietfix: choose a new password',
    ...message({
      greeting: `Hello ${p.name},`,
      lead: 'Someone (hopefully you) asked to reset your Quietfix password.',
      action: 'Choose a new password',
      link,
      footer: 'The link works once and expires after 72 hours. If you did not ask for this, ignore this message; your password stays as it is.',
    }),
  };
}
