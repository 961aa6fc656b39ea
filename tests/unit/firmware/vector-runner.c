/*
 * Runs the generated C reference over test vectors given on standard input, one
 * command per line, and prints what the C code computes, for the test to compare
 * with the TypeScript engine:
 *   K <text>                      -> K <crc32 of the ASCII text, 8 hex digits>
 *   B <image hex>                 -> H <status> <byte length> <slots> <crc stored> <crc computed> <signature block 0/1>
 *                                    S <slot> <every decoded field> and W <slot> <steady duty codes, pump fan, for codes 0..200>
 *   T <slot> <n> <reading|N>...   -> R <pump fan per tick> (N = no reading), for the slot of the last B
 */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "loopkeeper_bank.h"

#define MAX_IMAGE (LK_MAX_BANK_BYTES + 512)

static uint8_t image[MAX_IMAGE];
static size_t image_length;
static lk_bank_t bank;
static lk_slot_t slots[LK_MAX_SLOTS];
static char token[2 * MAX_IMAGE + 2];

static int hex_digit(char c) {
  if (c >= '0' && c <= '9') return c - '0';
  if (c >= 'a' && c <= 'f') return c - 'a' + 10;
  if (c >= 'A' && c <= 'F') return c - 'A' + 10;
  return -1;
}

static void print_curve(const char *name, const lk_curve_t *curve) {
  unsigned i;
  printf(" %s %u %u %u %u", name, curve->point_count, curve->hysteresis_code, curve->ramp_up_code, curve->ramp_down_code);
  for (i = 0; i < curve->point_count; i++) printf(" %u %u", curve->points[i].temp_code, curve->points[i].duty_code);
}

static void open_bank(void) {
  size_t n = strlen(token), i;
  lk_status_t status;
  unsigned s;
  image_length = n / 2;
  for (i = 0; i < image_length; i++) image[i] = (uint8_t)(hex_digit(token[2 * i]) * 16 + hex_digit(token[2 * i + 1]));
  status = lk_bank_open(image, image_length, &bank);
  printf("H %d %u %u %08lx %08lx %u\n", (int)status, bank.byte_length, bank.slot_count, (unsigned long)bank.crc_stored, (unsigned long)bank.crc_computed, bank.has_signature_block);
  if (status != LK_OK) return;
  for (s = 0; s < bank.slot_count; s++) {
    lk_slot_t *slot = &slots[s];
    int code;
    status = lk_slot_decode(image, &bank, (uint8_t)s, slot);
    if (status != LK_OK) {
      printf("S %u error %d\n", s, (int)status);
      continue;
    }
    printf("S %u %u ", s, slot->offset);
    for (i = 0; i < LK_HASH_PREFIX_BYTES; i++) printf("%02x", slot->hash_prefix[i]);
    printf(" %u.%u.%u %u %u %u", slot->version[0], slot->version[1], slot->version[2], slot->critical_temp_code, slot->sensor_loss_duty_code, slot->fan_stop_temp_code);
    print_curve("P", &slot->pump);
    print_curve("F", &slot->fans);
    printf("\nW %u", s);
    for (code = 0; code <= (int)LK_MAX_TEMP_CODE; code++) {
      uint8_t pump, fan;
      lk_steady_duty(slot, (int16_t)(code * LK_DECI_C_PER_TEMP_CODE), &pump, &fan);
      printf(" %u %u", pump, fan);
    }
    printf("\n");
  }
}

static void run_trace(void) {
  unsigned s, n, i;
  lk_control_t control;
  if (scanf("%u %u", &s, &n) != 2 || s >= LK_MAX_SLOTS) exit(3);
  lk_control_init(&control);
  printf("R");
  for (i = 0; i < n; i++) {
    uint8_t pump, fan;
    int16_t reading;
    if (scanf("%31s", token) != 1) exit(3);
    reading = token[0] == 'N' ? LK_TEMP_NONE : (int16_t)strtol(token, NULL, 10);
    lk_control_tick(&control, &slots[s], reading, &pump, &fan);
    printf(" %u %u", pump, fan);
  }
  printf("\n");
}

int main(void) {
  char command[4];
  while (scanf("%3s", command) == 1) {
    if (strcmp(command, "K") == 0) {
      if (scanf("%1000s", token) != 1) return 3;
      printf("K %08lx\n", (unsigned long)lk_crc32((const uint8_t *)token, strlen(token)));
    } else if (strcmp(command, "B") == 0) {
      if (scanf("%131999s", token) != 1) return 3;
      open_bank();
    } else if (strcmp(command, "T") == 0) {
      run_trace();
    } else {
      return 2;
    }
  }
  return 0;
}
