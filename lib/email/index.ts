export { invitationMessage, passwordResetMessage, type MailMessage } from "./messages";
