CREATE TABLE "known_sign_in_addresses" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"user_id" uuid NOT NULL,
	"client_address" text NOT NULL,
	"last_seen_at" timestamp with time zone DEFAULT now() NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "password_reset_requests" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"email" text NOT NULL,
	"client_address" text NOT NULL,
	"processed_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "known_sign_in_addresses" ADD CONSTRAINT "known_sign_in_addresses_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "known_sign_in_addresses_user_addr_idx" ON "known_sign_in_addresses" USING btree ("user_id","client_address");--> statement-breakpoint
CREATE INDEX "password_reset_requests_email_idx" ON "password_reset_requests" USING btree ("email","created_at");--> statement-breakpoint
CREATE INDEX "password_reset_requests_addr_idx" ON "password_reset_requests" USING btree ("client_address","created_at");--> statement-breakpoint
CREATE INDEX "password_reset_requests_pending_idx" ON "password_reset_requests" USING btree ("processed_at","created_at");