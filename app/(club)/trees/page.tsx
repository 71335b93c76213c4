import type { Metadata } from 'next';
import Link from 'next/link';
import { requirePageUser } from '@/lib/auth/page-guard';
import { listTrees } from '@/lib/data/trees';
import { TreesTable } from './_components/trees-table';
import { dueNowHeadlines } from '@/lib/data/tree-due-now';

export const metadata: Metadata = { title: 'Your trees' };

export default async function TreesPage() {
  const actor = await requirePageUser('/trees');
  const items = await listTrees(actor);
  const due = await dueNowHeadlines(items);
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="page-title">Your trees</h1>
        <Link href="/trees/new" className="btn-primary">
          Add a tree
        </Link>
      </div>
      <p className="max-w-2xl text-stone-700">Only you see your trees. Each keeps its container, history, answers and photos together.</p>
      <TreesTable initial={items} due={due} />
    </div>
  );
}
