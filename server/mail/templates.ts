import type { LabRole } from "@shared/schemas/roles";
import { config } from "../config";
import type { OutgoingMail } from "./mailer";

/** Plain-text e-mails with one link each; links are built on PUBLIC_URL. */
export function appLink(path: string, token: string): string {
  return `${config().publicUrl}${path}?token=${encodeURIComponent(token)}`;
}

const SIGNATURE = "\n\n— Rhomb, the shared two-photon tomography notebook\nIf you did not expect this message, you can ignore it.";

export function verificationMail(to: string, name: string, token: string, hours: number): OutgoingMail {
  return {
    to,
    subject: "Confirm your e-mail address for Rhomb",
    text: `Hello ${name},\n\nplease confirm that this is your e-mail address by opening this link:\n\n${appLink("/verify-email", token)}\n\nThe link works once and for ${hours} hours.${SIGNATURE}`,
  };
}

export function passwordResetMail(to: string, name: string, token: string, minutes: number): OutgoingMail {
  return {
    to,
    subject: "Choose a new Rhomb password",
    text: `Hello ${name},\n\nsomeone (hopefully you) asked to reset the password of your Rhomb account. Choose a new one here:\n\n${appLink("/reset-password", token)}\n\nThe link works once and for ${minutes} minutes. Your current password keeps working until you choose a new one.${SIGNATURE}`,
  };
}

const ROLE_WORDS: Record<LabRole, string> = {
  owner: "an owner (manages members and the lab)",
  member: "a member (adds sources, sessions, runs and reconstructions)",
  viewer: "a viewer (reads everything in the lab)",
};

export function invitationMail(to: string, lab: { name: string; institution: string }, inviter: string, role: LabRole, token: string, days: number): OutgoingMail {
  const where = lab.institution ? `${lab.name} (${lab.institution})` : lab.name;
  return {
    to,
    subject: `${inviter} invites you to ${lab.name} on Rhomb`,
    text: `Hello,\n\n${inviter} invites you to join the lab ${where} on Rhomb as ${ROLE_WORDS[role]}.\n\nAccept the invitation here (you can create an account on the way if you have none):\n\n${appLink("/invitation", token)}\n\nThe link works once and for ${days} days.${SIGNATURE}`,
  };
}
