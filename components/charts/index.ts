export { bandColour, okabeItoPalette } from "./palette";
