import type { UseFormReturn } from "react-hook-form";
import type { RequestFormValues } from "@/lib/requests/schemas";

export type RequestForm = UseFormReturn<RequestFormValues>;

export interface TelescopeOption {
  id: string;
  code: string;
  name: string;
  siteName: string;
}
