/** Purchase requests: create from the forecast, move through statuses, receive as lots. */
import { z } from "zod";
import { isoDate, objectParams, rangeNumber } from "./coatings";

export const createRequestsSchema = z
  .object(
    {
      lines: z
        .array(
          z.object({ coatingId: rangeNumber({ gte: 1, integer: true }), containers: rangeNumber({ gte: 1, lte: 10_000, integer: true }, "containers") }, objectParams).strict(),
          { error: "Choose at least one coating to order." },
        )
        .min(1, "Choose at least one coating to order."),
      notes: z.string().max(1000, "At most 1000 characters.").optional(),
    },
    objectParams,
  )
  .strict();
export type CreateRequestsInput = z.infer<typeof createRequestsSchema>;

export const requestStatusSchema = z
  .object({ status: z.enum(["confirmed", "cancelled"], { error: "Choose confirmed or cancelled (receive through the receive action)." }) }, objectParams)
  .strict();

export const receiveSchema = z
  .object(
    {
      lots: z
        .array(
          z
            .object(
              {
                lineId: rangeNumber({ gte: 1, integer: true }),
                lotNumber: z.string({ error: "Enter the lot number." }).trim().min(1, "Enter the lot number.").max(60, "At most 60 characters."),
                kgReceived: rangeNumber({ gt: 0, lte: 1_000_000 }, "kg"),
                receivedDate: isoDate,
                expiryDate: isoDate.optional(),
              },
              objectParams,
            )
            .strict(),
        )
        .min(1, "Enter at least one lot."),
      confirm: z.boolean().optional(),
    },
    objectParams,
  )
  .strict();
export type ReceiveInput = z.infer<typeof receiveSchema>;
