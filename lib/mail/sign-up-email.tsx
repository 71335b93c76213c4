import { Button, Heading, Link } from '@react-email/components';
import { MailFrame, P, mailColors } from './layout';

const headingStyle = { fontFamily: 'Georgia, "Times New Roman", serif', color: mailColors.mossDark, fontSize: '24px', margin: '0 0 12px' } as const;
const buttonStyle = {
  backgroundColor: mailColors.moss,
  color: '#ffffff',
  borderRadius: '8px',
  padding: '12px 20px',
  fontSize: '16px',
  fontWeight: 600,
  textDecoration: 'none',
} as const;

function LinkBlock({ url, label }: { url: string; label: string }) {
  return (
    <>
      <Button href={url} style={buttonStyle}>
        {label}
      </Button>
      <P style={{ fontSize: '14px', color: mailColors.faint, marginTop: '16px', wordBreak: 'break-all' }}>
        Or paste this address into your browser:{' '}
        <Link href={url} style={{ color: mailColors.moss }}>
          {url}
        </Link>
      </P>
    </>
  );
}

/** To a new address: the account is made when its owner opens the link. */
export function ConfirmSignUpEmail({ url, name, hours }: { url: string; name: string; hours: number }) {
  return (
    <MailFrame
      title="Confirm your Candlewise account"
      preview={`Open the link to finish creating your account. It works for ${hours} hours.`}
      footer={
        <P style={{ fontSize: '14px', color: mailColors.faint, margin: 0 }}>
          If you did not sign up, ignore this message: no account is made without the link.
        </P>
      }
    >
      <Heading as="h1" style={headingStyle}>
        Welcome, {name}
      </Heading>
      <P>
        Someone, we hope you, asked to create a Candlewise account with this e-mail address. Open the link to confirm it is yours; your account is ready as soon
        as you do. The link works once, for {hours} hours.
      </P>
      <LinkBlock url={url} label="Confirm my account" />
    </MailFrame>
  );
}

/** To an address that already has an account: nothing changed, here is the way in. */
export function AlreadyMemberEmail({ url }: { url: string }) {
  return (
    <MailFrame
      title="You already have a Candlewise account"
      preview="Someone tried to sign up with this address. Nothing changed."
      footer={
        <P style={{ fontSize: '14px', color: mailColors.faint, margin: 0 }}>
          If it was not you, you need do nothing: your password and your records are unchanged.
        </P>
      }
    >
      <Heading as="h1" style={headingStyle}>
        You already have an account
      </Heading>
      <P>Someone asked to create a new Candlewise account with this e-mail address, which already has one. We made no new account and changed nothing.</P>
      <P>If it was you and you have forgotten your password, open the sign-in page and ask for a sign-in link instead.</P>
      <LinkBlock url={url} label="Go to sign-in" />
    </MailFrame>
  );
}
