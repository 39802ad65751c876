// POST /api/payments/webhook: the payment provider's events. Called by the provider only: the signature over the
// raw body is the authentication (400 when it does not match). Replays are answered 200 and change nothing.
import { toErrorResponse } from "@/lib/errors";
import { verifyWebhook } from "@/lib/payments";
import { handleProviderEvent, recordEventFailure } from "@/db/queries/billing-events";
import { sendBillingNotices } from "@/lib/billing/mails";

export async function POST(request: Request): Promise<Response> {
  let event;
  try {
    event = verifyWebhook(await request.text(), request.headers.get("stripe-signature"));
  } catch (error) {
    return toErrorResponse(error);
  }
  try {
    const result = await handleProviderEvent(event);
    await sendBillingNotices(result.notices);
    return Response.json({ received: true, outcome: result.outcome, duplicate: result.duplicate });
  } catch (error) {
    // Left unprocessed: the provider retries and the next delivery runs it again.
    await recordEventFailure(event.id, error).catch(() => undefined);
    return toErrorResponse(error);
  }
}
