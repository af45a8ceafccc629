/** Actual use of a done run, and excluding a run from the running estimate. */
import { z } from "zod";
import { objectParams, rangeNumber } from "./coatings";

export const actualUseSchema = z
  .object(
    {
      coats: z
        .array(
          z
            .object(
              {
                coatIndex: rangeNumber({ gte: 0, integer: true }),
                partsCoated: rangeNumber({ gte: 1, lte: 10_000_000, integer: true }, "parts"),
                // 0 kg is let through to the service, which names it in words
                kgUsed: rangeNumber({ gte: 0, lte: 1_000_000 }, "kg"),
              },
              objectParams,
            )
            .strict(),
        )
        .min(1, "Enter the powder used for at least one coat."),
      confirm: z.boolean().optional(),
    },
    objectParams,
  )
  .strict();
export type ActualUseInput = z.infer<typeof actualUseSchema>;

export const feedbackPatchSchema = z.object({ excluded: z.boolean({ error: "Send excluded: true or false." }) }, objectParams).strict();

export const feedbackResetSchema = z
  .object({ lineId: rangeNumber({ gte: 1, integer: true }), coatingId: rangeNumber({ gte: 1, integer: true }) }, objectParams)
  .strict();
