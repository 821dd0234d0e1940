export { fitFinishedMessage, invitationMessage, passwordResetMessage, type MailMessage } from "./messages";
