// The fields of a site measurement record besides its file (the add form and the API's
// multipart fields): zod, one message per field, named as the form names them.
import { z } from "zod";

const isoDate = z
  .string()
  .trim()
  .regex(/^\d{4}-\d{2}-\d{2}$/, "Enter a date as YYYY-MM-DD")
  .refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().slice(0, 10) === s, "Not a calendar date");

const text = (label: string, max: number) => z.string().trim().min(1, `Say ${label}`).max(max, `At most ${max} characters`);

export const MAX_MEASUREMENT_SPEED_RPM = 100_000;

export const measurementFieldsSchema = z
  .object({
    measuredOn: isoDate,
    measuredBy: text("who measured", 200),
    instrument: text("which instrument", 200),
    instrumentCalibratedOn: isoDate,
    speedRpm: z.coerce
      .number({ message: "Enter the running speed in rpm" })
      .refine((v) => Number.isFinite(v) && v > 0, "The running speed must be above 0 rpm")
      .refine((v) => v <= MAX_MEASUREMENT_SPEED_RPM, `At most ${MAX_MEASUREMENT_SPEED_RPM} rpm`),
    load: z.string().trim().max(200, "At most 200 characters").default(""),
    kind: z.enum(["readings", "run-up"], { message: 'Choose "readings" or "run-up"' }),
    note: z.string().trim().max(2000, "At most 2000 characters").default(""),
    // ISO 10816-3 machine group for the severity zones: 1 above 300 kW, 2 from 15 to 300 kW.
    // Not stated: group 2, whose boundaries are the lower ones (the safe side).
    machineGroup: z
      .enum(["", "1", "2"], { message: 'Choose machine group "1" or "2"' })
      .optional()
      .transform((v) => (v === "1" ? (1 as const) : v === "2" ? (2 as const) : undefined)),
    supersedesId: z
      .string()
      .trim()
      .optional()
      .transform((v) => (v ? v : null))
      .refine((v) => v === null || /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(v), "Not a record id"),
  })
  .superRefine((v, ctx) => {
    const today = new Date().toISOString().slice(0, 10);
    if (v.measuredOn > today) ctx.addIssue({ code: "custom", path: ["measuredOn"], message: "The measurement date is in the future" });
    if (v.instrumentCalibratedOn > v.measuredOn) ctx.addIssue({ code: "custom", path: ["instrumentCalibratedOn"], message: "The instrument's calibration date is after the measurement" });
  });

export type MeasurementFields = z.infer<typeof measurementFieldsSchema>;
