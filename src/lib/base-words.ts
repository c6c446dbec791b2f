/** A base as a list or a choice names it. */
export interface BaseOption {
  code: string;
  name: string;
}

/** A base as the desk names it: "North Pad (NPD)", the name people say and the code on tags and boards. */
export const baseWords = (base: BaseOption) => `${base.name} (${base.code})`;
