export { default } from "@/components/page-skeleton";
