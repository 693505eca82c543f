/* RP2040 boot stage 2, written for Clockgraft from the RP2040
 * datasheet (bootrom: boot sequence and the 256-byte stage-2 block; XIP and
 * SSI chapter: CTRLR0, CTRLR1, SSIENR, BAUDR, SPI_CTRLR0 fields).
 *
 * The ROM copies these 252 bytes (plus their CRC-32) to SRAM at 0x20041f00
 * and enters here in Thumb state with SP = 0x20042000, clk_sys on the ring
 * oscillator. This code calls nothing in the ROM. It
 *   1. sets the flash interface up for execute-in-place with the plain
 *      serial read command 03h (every SPI NOR flash has it; 24-bit address,
 *      8-bit instruction, one 32-bit frame per access), SCK = clk_sys / 4:
 *      at most 33.25 MHz at the 133 MHz top clock, inside what common 03h
 *      reads allow (about 50 MHz, from memory);
 *   2. points VTOR at the vector table at 0x10000100;
 *   3. loads SP from the table's first word and jumps to its reset vector.
 */
    .syntax unified
    .cpu cortex-m0plus
    .thumb

    .equ XIP_SSI_BASE, 0x18000000
    .equ SSI_CTRLR0, 0x00
    .equ SSI_CTRLR1, 0x04
    .equ SSI_SSIENR, 0x08
    .equ SSI_BAUDR, 0x14
    .equ SSI_SPI_CTRLR0, 0xf4
    .equ PPB_VTOR, 0xe000ed08
    .equ VECTORS, 0x10000100

    /* CTRLR0: SPI_FRF (bits 22:21) = 0 standard SPI, DFS_32 (20:16) = 31 for
     * 32-bit frames, TMOD (9:8) = 3 EEPROM read (send command + address, then
     * receive). */
    .equ CTRLR0_XIP, (31 << 16) | (3 << 8)
    /* SPI_CTRLR0: XIP_CMD (31:24) = 03h, INST_L (9:8) = 2 for an 8-bit
     * instruction, ADDR_L (5:2) = 6 for 24 address bits (in 4-bit units),
     * TRANS_TYPE (1:0) = 0 command and address both serial. */
    .equ SPI_CTRLR0_XIP, (0x03 << 24) | (2 << 8) | (6 << 2)

    .section .text.stage2, "ax"
    .global stage2_entry
    .type stage2_entry, %function
    .thumb_func
stage2_entry:
    ldr r3, =XIP_SSI_BASE
    movs r0, #0
    str r0, [r3, #SSI_SSIENR]   /* the SSI takes new settings only while disabled */
    movs r0, #4
    str r0, [r3, #SSI_BAUDR]    /* SCK = clk_sys / 4 (BAUDR must be even) */
    ldr r0, =CTRLR0_XIP
    str r0, [r3, #SSI_CTRLR0]
    movs r0, #0
    str r0, [r3, #SSI_CTRLR1]   /* NDF = 0: one data frame per access */
    ldr r0, =SPI_CTRLR0_XIP
    movs r1, #SSI_SPI_CTRLR0
    str r0, [r3, r1]
    movs r0, #1
    str r0, [r3, #SSI_SSIENR]   /* enabled: flash reads at 0x10000000 now go through XIP */

    ldr r0, =VECTORS
    ldr r1, =PPB_VTOR
    str r0, [r1]                /* exceptions now vector from the image's own table */
    ldr r1, [r0]
    msr msp, r1                 /* initial SP from the table's first word */
    ldr r1, [r0, #4]
    bx r1                       /* reset vector (Thumb bit set by the linker) */

    .ltorg
    .size stage2_entry, . - stage2_entry
