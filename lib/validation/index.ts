// One import for forms and route handlers: every request schema of the API.
export * from "./common";
export * from "./auth";
export * from "./team";
export * from "./invitation";
export * from "./profile";
export * from "./set";
export * from "./clip";
export * from "./analysis";
export * from "./billing";
