import nodemailer, { type Transporter } from "nodemailer";
import { getEnv } from "./env";

let transport: Transporter | undefined;

/** SMTP from SMTP_URL: the local fake under `npm start`, a hosted service in production. */
function getTransport(): Transporter {
  transport ??= nodemailer.createTransport(getEnv().SMTP_URL);
  return transport;
}

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
}

export async function sendMail(mail: OutgoingMail): Promise<void> {
  await getTransport().sendMail({ from: getEnv().MAIL_FROM, ...mail });
}

/** Links in mail always use the configured public origin, whatever host a request came to. */
export function appLink(pathAndQuery: string): string {
  return new URL(pathAndQuery, getEnv().APP_URL).toString();
}
