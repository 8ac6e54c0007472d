"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { userSearchFormSchema, type UserSearchForm as SearchInput } from "@/lib/validations/admin";

/** Search accounts by part of the e-mail address or name; the search runs on the server (the address holds it, so Back works). */
export function UserSearchForm({ q }: { q: string }) {
  const router = useRouter();
  const { register, handleSubmit, formState } = useForm<SearchInput>({ resolver: zodResolver(userSearchFormSchema), defaultValues: { q } });

  function onValid(data: SearchInput) {
    const query = data.q.trim();
    router.push(query ? `/admin?q=${encodeURIComponent(query)}` : "/admin");
  }

  return (
    <form onSubmit={handleSubmit(onValid)} role="search" aria-label="Accounts" className="flex items-end gap-2" noValidate>
      <div className="flex-1">
        <TextField id="user-search" type="search" label="E-mail or name" autoComplete="off" {...register("q")} error={formState.errors.q?.message} />
      </div>
      <Button type="submit" variant="secondary">
        Search
      </Button>
    </form>
  );
}
