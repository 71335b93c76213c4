import 'server-only';
import { createElement } from 'react';
import { render } from '@react-email/render';
import { sendMail } from './transport';
import { SignInEmail } from './sign-in-email';

export async function signInLinkMail(url: string) {
  const text = [
    'Sign in to Candlewise',
    '',
    'Open this link to sign in. It works once and expires in 15 minutes:',
    url,
    '',
    'If you did not ask for it, ignore this message: nobody can sign in without the link.',
  ].join('\n');
  const html = await render(createElement(SignInEmail, { url }));
  return { subject: 'Your Candlewise sign-in link', text, html };
}

export async function sendSignInLink(to: string, url: string) {
  await sendMail({ to, ...(await signInLinkMail(url)) });
}
