/** A case-page form the server refused: which form, the message, and what was typed (to keep it). */
export interface FormRefusal {
  status: number;
  message: string;
  /** `review-<action>`, `comment`, `reply` or `resolve`. */
  intent: string;
  /** The thread a reply or resolution was for. */
  threadId?: string;
  values: Record<string, string>;
}
