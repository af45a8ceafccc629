import { getDb } from "@/db/index";
import { getPlantSettings, savePlantSettings } from "@/db/queries/plant-settings";
import type { UnitSystem } from "@/db/schema";

export interface PlantSettingsView {
  plantName: string;
  currency: string;
  shiftHours: number;
  defaultUnitSystem: UnitSystem;
}

export async function plantSettings(): Promise<PlantSettingsView> {
  const s = await getPlantSettings(await getDb());
  return {
    plantName: s?.plant_name ?? "Finishing department",
    currency: s?.currency ?? "USD",
    shiftHours: s?.shift_hours ?? 8,
    defaultUnitSystem: s?.default_unit_system ?? "metric",
  };
}

export async function updatePlantSettings(v: PlantSettingsView): Promise<PlantSettingsView> {
  await savePlantSettings(await getDb(), {
    plant_name: v.plantName,
    currency: v.currency,
    shift_hours: v.shiftHours,
    default_unit_system: v.defaultUnitSystem,
    updated_at: Math.floor(Date.now() / 1000),
  });
  return plantSettings();
}
