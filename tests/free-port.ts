// The tests look for free ports the same way the server does.
export { freePort } from "@/lib/net/free-port";
