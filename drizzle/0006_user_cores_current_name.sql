-- Two current user cores never share a name, as for materials (materials_current_name_idx): the service checks first,
-- but only the index decides between two writers saving the same name at the same moment.
CREATE UNIQUE INDEX "user_cores_current_name_idx" ON "user_cores" USING btree (lower("name")) WHERE "user_cores"."current";