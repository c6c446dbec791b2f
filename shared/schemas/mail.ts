export interface CaughtMailItem {
  id: number;
  to: string;
  subject: string;
  text: string;
  receivedAt: string;
}
