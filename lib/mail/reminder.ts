import { createElement } from 'react';
import { render } from '@react-email/render';
import type { WeekItem } from '@/lib/data/plan';
import { digestHeaders } from './digest';
import { ReminderEmail } from './reminder-email';

// The weekly reminder: the member's "This week" items for one week, grouped by tree, with the
// same one-click unsubscribe headers as the meeting-notes digest (its link stops the reminders).

export interface ReminderTree {
  name: string;
  url: string;
  tasks: { label: string; from: string; when: string }[];
}

export interface ReminderInput {
  clubName: string;
  baseUrl: string;
  /** The Monday of the week, ISO date. */
  weekOf: string;
  items: WeekItem[];
  unsubscribeUrl: string;
}

const longDate = (iso: string) => new Date(`${iso}T12:00:00Z`).toLocaleDateString('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });

/** Tasks grouped by tree, trees in the order of their first task (the items come sorted by date). */
function groupByTree(items: WeekItem[], baseUrl: string, weekOf: string): ReminderTree[] {
  const byTree = new Map<string, ReminderTree>();
  for (const it of items) {
    const tree = byTree.get(it.treeId) ?? { name: it.treeName, url: `${baseUrl}/trees/${it.treeId}`, tasks: [] };
    byTree.set(it.treeId, tree);
    const when = it.window.from <= weekOf ? `open now, until ${longDate(it.window.to)}` : `from ${longDate(it.window.from)} to ${longDate(it.window.to)}`;
    tree.tasks.push({ label: it.window.label, from: it.window.from, when });
  }
  return [...byTree.values()];
}

export async function renderReminder(input: ReminderInput) {
  const weekLabel = longDate(input.weekOf);
  const trees = groupByTree(input.items, input.baseUrl, input.weekOf);
  const subject = `${input.clubName}: your trees in the week of ${weekLabel}`;
  const homeUrl = `${input.baseUrl}/`;
  const text = [
    `${input.clubName} — your trees in the week of ${weekLabel}`,
    '',
    ...trees.flatMap((t) => [t.name, ...t.tasks.map((task) => `  - ${task.label}: ${task.when}`), `  ${t.url}`, '']),
    '—',
    `Open This week on the club site: ${homeUrl}`,
    `You get this because you turned on the weekly reminder on your profile. Stop these e-mails: ${input.unsubscribeUrl}`,
  ].join('\n');
  const html = await render(
    createElement(ReminderEmail, { clubName: input.clubName, weekLabel, trees, homeUrl, unsubscribeUrl: input.unsubscribeUrl, subject }),
  );
  return { subject, text, html, headers: digestHeaders(input.unsubscribeUrl), tasks: input.items.length };
}
