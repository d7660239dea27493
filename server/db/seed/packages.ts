export async function seedPackages(..._args: unknown[]) {}
