import { parseQuery, route } from '@/lib/http/route';
import { getCurrentUser, requireRole } from '@/lib/auth/session';
import { getSpeciesForViewer } from '@/lib/data/species';
import { parseSlug, revisionQuerySchema } from '@/lib/http/species-params';
import { serializeSpeciesMarkdown } from '@/lib/species/content';

// Anyone: the published revision as a species .md file; `?revision=N` for editors and admins.
export const GET = route<{ slug: string }>(async (req, ctx) => {
  const slug = parseSlug(await ctx.params);
  const { revision } = parseQuery(req, revisionQuerySchema);
  const viewer = revision === undefined ? await getCurrentUser() : await requireRole('editor', 'revision');
  const s = await getSpeciesForViewer(viewer, slug, revision);
  const name = revision === undefined ? `${s.slug}.md` : `${s.slug}-r${s.revision}.md`;
  return new Response(serializeSpeciesMarkdown(s.record, s.body), {
    headers: {
      'content-type': 'text/markdown; charset=utf-8',
      'content-disposition': `attachment; filename="${name}"`,
      'x-content-type-options': 'nosniff',
    },
  });
});
