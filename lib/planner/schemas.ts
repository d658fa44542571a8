import { z } from "zod";

export const plannerHistoryQuery = z.object({ systemId: z.string().uuid("not a valid id") });
