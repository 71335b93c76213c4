import { NextResponse } from 'next/server';
import { route } from '@/lib/http/route';
import { offlineWizardData } from '@/lib/data/wizard';

// Public, like evaluate: the published species and the club's settings the engine reads, so a
// phone that has opened the wizard once can work out answers with no signal. The service worker
// keeps the latest copy; the browser itself must revalidate every time.
export const GET = route(async () => {
  return NextResponse.json(await offlineWizardData(), { headers: { 'cache-control': 'no-cache' } });
});
