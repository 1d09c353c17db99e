/** The tool version written into every manifest (kept equal to package.json by a test). */
export const TOOL_VERSION = '0.1.0';
