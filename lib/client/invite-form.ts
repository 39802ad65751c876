// The invite form's schema: a pasted list of addresses in, the API's `{ emails }` out.
import { z } from "zod";
import { emailSchema } from "@/lib/validation/common";
import { inviteSchema, splitEmailList, type InviteInput } from "@/lib/validation/invitation";

export interface InviteFormValues {
  emails: string;
}

export const inviteFormSchema = z
  .object({ emails: z.string() })
  .transform((values, ctx): InviteInput => {
    const addresses = splitEmailList(values.emails);
    const invalid = addresses.filter((address) => !emailSchema.safeParse(address).success);
    if (invalid.length > 0) {
      const listed = invalid.slice(0, 3).join(", ") + (invalid.length > 3 ? ` and ${invalid.length - 3} more` : "");
      ctx.addIssue({ code: "custom", path: ["emails"], message: `Not a valid address: ${listed}.` });
      return z.NEVER;
    }
    // Duplicates in one paste are one invitation.
    const parsed = inviteSchema.safeParse({ emails: [...new Set(addresses.map((a) => emailSchema.parse(a)))] });
    if (parsed.success) return parsed.data;
    ctx.addIssue({ code: "custom", path: ["emails"], message: parsed.error.issues[0]?.message ?? "Check the addresses." });
    return z.NEVER;
  });
