"use server";
import { revalidatePath } from "next/cache";
import { getDb } from "@/db/index";
import { updateUser } from "@/db/queries/users";
import { ActionDenied, requireActionUser } from "@/lib/server/guard";
import { unitSystemSchema } from "@/lib/validation/auth";

export interface ActionState {
  message: string | null;
  errors: Record<string, string>;
}

export async function saveUnitSystem(_prev: ActionState, form: FormData): Promise<ActionState> {
  let user;
  try {
    user = await requireActionUser("app/(app)/settings/actions.ts#saveUnitSystem");
  } catch (e) {
    if (e instanceof ActionDenied) return { message: e.message, errors: {} };
    throw e;
  }
  const parsed = unitSystemSchema.safeParse(form.get("unitSystem"));
  if (!parsed.success) return { message: null, errors: { unitSystem: parsed.error.issues[0].message } };
  await updateUser(await getDb(), user.id, { unit_system: parsed.data });
  revalidatePath("/", "layout");
  return { message: parsed.data === "us" ? "Showing US customary units." : "Showing metric units.", errors: {} };
}
