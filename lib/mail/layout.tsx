import type { ReactNode } from 'react';
import { Body, Container, Head, Hr, Html, Preview, Section, Text } from '@react-email/components';

// The frame every Candlewise e-mail shares, built from React Email's components: table-based
// layout and inline styles, which hold in common mail programs and on narrow phone screens.

export const mailColors = {
  ink: '#1f1f1c',
  muted: '#484842',
  faint: '#5c5c53',
  moss: '#33522c',
  mossDark: '#233721',
  mossLine: '#9dbf8e',
  mossWash: '#f3f7f1',
  bark: '#5c4533',
  rule: '#dcdcd5',
  page: '#f7f7f5',
};

const mailFont = 'system-ui, -apple-system, "Segoe UI", Roboto, Helvetica, Arial, sans-serif';

export function MailFrame({ title, preview, children, footer }: { title: string; preview: string; children: ReactNode; footer: ReactNode }) {
  return (
    <Html lang="en">
      <Head>
        <title>{title}</title>
      </Head>
      <Preview>{preview}</Preview>
      <Body style={{ backgroundColor: mailColors.page, color: mailColors.ink, fontFamily: mailFont, margin: 0, padding: '16px 0' }}>
        <Container
          style={{
            maxWidth: '600px',
            width: '100%',
            backgroundColor: '#ffffff',
            border: `1px solid ${mailColors.rule}`,
            borderRadius: '8px',
            padding: '16px 20px',
          }}
        >
          {children}
          <Hr style={{ borderColor: mailColors.rule, margin: '24px 0 12px' }} />
          <Section style={{ fontSize: '14px', lineHeight: '1.5', color: mailColors.faint }}>{footer}</Section>
        </Container>
      </Body>
    </Html>
  );
}

const pStyle = { fontSize: '16px', lineHeight: '1.55', margin: '0 0 12px' } as const;
export function P({ children, style }: { children: ReactNode; style?: Record<string, string | number> }) {
  return <Text style={{ ...pStyle, ...style }}>{children}</Text>;
}
