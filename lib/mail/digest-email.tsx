import { Heading, Link, Section } from '@react-email/components';
import { MailFrame, P, mailColors } from './layout';

/** The HTML part of a meeting-note digest. `bodyHtml` is the note's sanitized HTML, styles inlined. */
export function DigestEmail(props: {
  clubName: string;
  when: string;
  title: string;
  authorName: string;
  bodyHtml: string;
  noteUrl: string;
  unsubscribeUrl: string;
  subject: string;
}) {
  return (
    <MailFrame
      title={props.subject}
      preview={`${props.title}: notes from the meeting of ${props.when}`}
      footer={
        <>
          <P style={{ fontSize: '14px', color: mailColors.faint }}>
            <Link href={props.noteUrl} style={{ color: mailColors.moss, textDecoration: 'underline' }}>
              Read it on the club site
            </Link>
          </P>
          <P style={{ fontSize: '14px', color: mailColors.faint, margin: 0 }}>
            You get these because you asked for meeting notes by e-mail.{' '}
            <Link href={props.unsubscribeUrl} style={{ color: mailColors.moss, textDecoration: 'underline' }}>
              Stop these e-mails
            </Link>
            .
          </P>
        </>
      }
    >
      <P style={{ textTransform: 'uppercase', letterSpacing: '0.05em', fontSize: '13px', color: mailColors.bark }}>
        {props.clubName} · meeting of {props.when}
      </P>
      <Heading
        as="h1"
        style={{ fontFamily: 'Georgia, "Times New Roman", serif', color: mailColors.mossDark, fontSize: '26px', lineHeight: '1.25', margin: '0 0 8px' }}
      >
        {props.title}
      </Heading>
      <P>Written by {props.authorName}</P>
      <Section style={{ fontSize: '16px', lineHeight: '1.55', overflowWrap: 'anywhere' }}>
        <div dangerouslySetInnerHTML={{ __html: props.bodyHtml }} />
      </Section>
    </MailFrame>
  );
}
