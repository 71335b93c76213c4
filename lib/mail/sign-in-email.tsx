import { Button, Heading, Link } from '@react-email/components';
import { MailFrame, P, mailColors } from './layout';

export function SignInEmail({ url }: { url: string }) {
  return (
    <MailFrame
      title="Your Candlewise sign-in link"
      preview="Open the link to sign in. It works once and expires in 15 minutes."
      footer={
        <P style={{ fontSize: '14px', color: mailColors.faint, margin: 0 }}>
          If you did not ask for it, ignore this message: nobody can sign in without the link.
        </P>
      }
    >
      <Heading as="h1" style={{ fontFamily: 'Georgia, "Times New Roman", serif', color: mailColors.mossDark, fontSize: '24px', margin: '0 0 12px' }}>
        Sign in to Candlewise
      </Heading>
      <P>Open this link to sign in to Candlewise. It works once and expires in 15 minutes.</P>
      <Button
        href={url}
        style={{
          backgroundColor: mailColors.moss,
          color: '#ffffff',
          borderRadius: '8px',
          padding: '12px 20px',
          fontSize: '16px',
          fontWeight: 600,
          textDecoration: 'none',
        }}
      >
        Sign in to Candlewise
      </Button>
      <P style={{ fontSize: '14px', color: mailColors.faint, marginTop: '16px', wordBreak: 'break-all' }}>
        Or paste this address into your browser:{' '}
        <Link href={url} style={{ color: mailColors.moss }}>
          {url}
        </Link>
      </P>
    </MailFrame>
  );
}
