import { stringify } from 'yaml';

/** A note as a Markdown file: YAML front matter (title, meeting date, status) and the body as written. */
export function noteAsMarkdown(note: { title: string; meetingDate: string; status: string; authorName: string; body: string }): string {
  const front = stringify({ title: note.title, meetingDate: note.meetingDate, status: note.status, author: note.authorName }).trimEnd();
  return `---\n${front}\n---\n\n${note.body.trimEnd()}\n`;
}
