/** One string from a page's searchParams (?edit=…); repeated or missing keys give undefined. */
export function singleParam(value: string | string[] | undefined): string | undefined {
  return typeof value === "string" && value !== "" ? value : undefined;
}
