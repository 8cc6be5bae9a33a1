declare module "algebrite" {
  export function run(expression: string): string;
  export function clearall(): void;
  const Algebrite: { run(expression: string): string; clearall(): void };
  export default Algebrite;
}
