import { NotInLibrary } from "@/components/not-in-library";

export default NotInLibrary;
