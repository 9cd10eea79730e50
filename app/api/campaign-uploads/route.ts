import { NextResponse } from 'next/server';
import { apiRoute } from '@/server/api/route';
import { receiveCampaign } from '@/server/campaigns/receive-campaign';
import { campaignUploadQuerySchema } from '@/server/validation/campaign-upload';

export const runtime = 'nodejs';
export const dynamic = 'force-dynamic';

/**
 * POST /api/campaign-uploads?serviceProfileId=…&climateProfileId=…&targetAvailabilityPercent=…&filename=…
 * with the campaign CSV as the body (text/csv, up to a million sites, streamed: never read whole).
 * 202 { id, rowsTotal, sitesTotal, problemsCount, chunks } once every chunk is queued; 422 for a file
 * that cannot be a campaign, 403 plan_limit over the plan's sites per campaign, 503 queue_unavailable
 * when Redis is out of reach — in every refusal nothing is kept or queued.
 * (proxy.ts leaves this path alone: with the proxy in front Next would copy the body first.)
 */
export const POST = apiRoute({ permission: 'study.write' }, async ({ req, ctx }) => {
  const query = campaignUploadQuerySchema.parse(Object.fromEntries(new URL(req.url).searchParams));
  const received = await receiveCampaign({ companyId: ctx.companyId, userId: ctx.apiKey ? null : ctx.user.id, query, body: req.body });
  return NextResponse.json(received, { status: 202, headers: { 'Cache-Control': 'no-store', Location: `/campaigns/${received.id}` } });
});
