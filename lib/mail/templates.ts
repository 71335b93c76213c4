import 'server-only';
import { createElement } from 'react';
import { render } from '@react-email/render';
import { sendMail } from './transport';
import { SignInEmail } from './sign-in-email';
import { AlreadyMemberEmail, ConfirmSignUpEmail } from './sign-up-email';

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

export async function sendSignUpConfirmation(to: string, name: string, url: string, hours: number) {
  const text = [
    `Welcome, ${name}`,
    '',
    `Someone, we hope you, asked to create a Candlewise account with this e-mail address. Open this link to confirm it is yours. It works once, for ${hours} hours:`,
    url,
    '',
    'If you did not sign up, ignore this message: no account is made without the link.',
  ].join('\n');
  const html = await render(createElement(ConfirmSignUpEmail, { url, name, hours }));
  await sendMail({ to, subject: 'Confirm your Candlewise account', text, html });
}

export async function sendAlreadyMember(to: string, url: string) {
  const text = [
    'You already have a Candlewise account',
    '',
    'Someone asked to create a new Candlewise account with this e-mail address, which already has one. We made no new account and changed nothing.',
    'If it was you and you have forgotten your password, open the sign-in page and ask for a sign-in link instead:',
    url,
    '',
    'If it was not you, you need do nothing: your password and your records are unchanged.',
  ].join('\n');
  const html = await render(createElement(AlreadyMemberEmail, { url }));
  await sendMail({ to, subject: 'You already have a Candlewise account', text, html });
}
