// Kept in step with package.json by hand; a test checks the two agree.
export const VERSION = "0.1.0";
