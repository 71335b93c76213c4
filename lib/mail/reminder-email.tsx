import { Heading, Link, Section } from '@react-email/components';
import { MailFrame, P, mailColors } from './layout';
import type { ReminderTree } from './reminder';

/** The HTML part of the weekly reminder: one section per tree, its tasks below it. */
export function ReminderEmail(props: { clubName: string; weekLabel: string; trees: ReminderTree[]; homeUrl: string; unsubscribeUrl: string; subject: string }) {
  const link = { color: mailColors.moss, textDecoration: 'underline' };
  return (
    <MailFrame
      title={props.subject}
      preview={`What is due on your trees in the week of ${props.weekLabel}`}
      footer={
        <>
          <P style={{ fontSize: '14px', color: mailColors.faint }}>
            <Link href={props.homeUrl} style={link}>
              Open This week on the club site
            </Link>
          </P>
          <P style={{ fontSize: '14px', color: mailColors.faint, margin: 0 }}>
            You get this because you turned on the weekly reminder on your profile.{' '}
            <Link href={props.unsubscribeUrl} style={link}>
              Stop these e-mails
            </Link>
            .
          </P>
        </>
      }
    >
      <P style={{ textTransform: 'uppercase', letterSpacing: '0.05em', fontSize: '13px', color: mailColors.bark }}>
        {props.clubName} · week of {props.weekLabel}
      </P>
      <Heading
        as="h1"
        style={{ fontFamily: 'Georgia, "Times New Roman", serif', color: mailColors.mossDark, fontSize: '26px', lineHeight: '1.25', margin: '0 0 8px' }}
      >
        Your trees this week
      </Heading>
      {props.trees.map((t) => (
        <Section key={t.url} style={{ margin: '0 0 12px' }}>
          <P style={{ fontWeight: 600, margin: '0 0 4px' }}>
            <Link href={t.url} style={link}>
              {t.name}
            </Link>
          </P>
          <ul style={{ margin: '0 0 8px', paddingLeft: '20px', fontSize: '16px', lineHeight: '1.55' }}>
            {t.tasks.map((task) => (
              <li key={`${task.label}-${task.from}`}>
                {task.label}: {task.when}
              </li>
            ))}
          </ul>
        </Section>
      ))}
    </MailFrame>
  );
}
