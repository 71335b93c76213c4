import 'server-only';
import { sendMail } from './transport';

export function escapeHtml(s: string) {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

export function signInLinkMail(url: string) {
  const text = [
    'Sign in to Candlewise',
    '',
    'Open this link to sign in. It works once and expires in 15 minutes:',
    url,
    '',
    'If you did not ask for it, ignore this message: nobody can sign in without the link.',
  ].join('\n');
  const html = `<p>Open this link to sign in to Candlewise. It works once and expires in 15 minutes.</p>
<p><a href="${escapeHtml(url)}">Sign in to Candlewise</a></p>
<p>If you did not ask for it, ignore this message: nobody can sign in without the link.</p>`;
  return { subject: 'Your Candlewise sign-in link', text, html };
}

export async function sendSignInLink(to: string, url: string) {
  await sendMail({ to, ...signInLinkMail(url) });
}
