export { GET, POST } from "@/lib/server/auth-handler";
