"use client";

import Link from "next/link";
import { useState } from "react";
import { useQueryClient } from "@tanstack/react-query";
import { VehicleForm } from "@/components/fleet/vehicle-form";
import type { VehicleSummary } from "@/lib/data/vehicles";

/** "Add a vehicle": opens the form; a new vehicle refreshes the fleet table and offers a link to it. */
export function AddVehicle({ slug }: { slug: string }) {
  const [open, setOpen] = useState(false);
  const [added, setAdded] = useState<VehicleSummary | null>(null);
  const queryClient = useQueryClient();
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center gap-3">
        <button
          type="button"
          className="btn-primary"
          aria-expanded={open}
          aria-controls="add-vehicle-panel"
          onClick={() => setOpen((o) => !o)}
        >
          {open ? "Close the form" : "Add a vehicle"}
        </button>
        {added ? (
          <p role="status" className="rounded-lg border border-steady/30 bg-steady-soft px-3 py-1.5 text-sm">
            {added.name} is in the fleet.{" "}
            <Link href={`/w/${slug}/vehicles/${added.id}`} className="link">
              Open {added.name}
            </Link>{" "}
            to add its sensors.
          </p>
        ) : null}
      </div>
      {open ? (
        <section id="add-vehicle-panel" className="card p-6" aria-labelledby="add-vehicle-heading">
          <h2 id="add-vehicle-heading" className="mb-4 text-lg font-semibold">
            Add a vehicle
          </h2>
          <VehicleForm
            slug={slug}
            onSaved={(vehicle, form) => {
              form.reset();
              setAdded(vehicle);
              void queryClient.invalidateQueries({ queryKey: ["vehicles", slug] });
            }}
            onCancel={() => setOpen(false)}
          />
        </section>
      ) : null}
    </div>
  );
}
