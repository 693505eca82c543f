; PIC12F1840 replacement timing stage: the image source (gpasm, gputils)
; Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
; Revision r1, engine 1.0.0; target 2 (pic12f1840-2)
; TIMER2, mode isr, clock 4.000000 MHz, output RA2 (GPIO, pin 5)
; Period 20.00000 ms (+0.000 ppm), high 1.024000 ms (+2.400 %)
; Register values: PIC12(L)F1840 datasheet (DS40001441), oscillator, Timer2 and
; CCP chapters. The same start-up steps, in the same order, are in src/main.c.

    list    p=12f1840
    radix   dec
    #include <p12f1840.inc>
    errorlevel -302                 ; every access below is preceded by BANKSEL

; Configuration words (datasheet Register 4-1 CONFIG1, 4-2 CONFIG2).
; XT: 4 MHz crystal on OSC1/OSC2. Watchdog off (nothing here services it), power-up timer on,
; MCLR as reset (10 kOhm pull-up on pin 4), brown-out reset on at the high trip
; point, fail-safe clock monitor off (a failed clock stops the output rather
; than running it at the wrong rate), high-voltage programming only.
    __CONFIG _CONFIG1, _FOSC_XT & _WDTE_OFF & _PWRTE_ON & _MCLRE_ON & _CP_OFF & _CPD_OFF & _BOREN_ON & _CLKOUTEN_OFF & _IESO_OFF & _FCMEN_OFF
    __CONFIG _CONFIG2, _WRT_OFF & _PLLEN_OFF & _STVREN_ON & _BORV_HI & _LVP_OFF

; Triggered one-shot: input RA1 (IOC (IOCAP1/IOCAN1), pin 6), falling edge: IOCAN1 = 1
; Output RA2 (pin 5), switched by the Timer2 match handler: on after 63 counts
; (4.032000 ms), off 16 counts later (1.024000 ms); one count = 64 instruction cycles.
; Worst-case edge-to-count latency 104 clocks (26.00000 us): PIC12F1840 datasheet, interrupt latency up to 5 instruction cycles for an asynchronous interrupt such as interrupt-on-change (from memory); IOC handler (templates/pic12f1840/trigger.asm.hbs) up to 7 instruction cycles to the start of the count (ignore rule 6: banksel 1, btfss skipping 2, banksel 1, btfss 1, bsf TMR2ON 1; restart rule 7: banksel 1, btfss 2, banksel 1, bcf TMR2ON 1, clrf TMR2 1, bsf TMR2ON 1); the Timer2 match handler's entry to the LATA write adds up to 4 (synchronous interrupt latency, from memory) + 10, the same for the pulse's off edge, so it shifts the delay, not the pulse; 4 clocks per instruction cycle; an edge arriving while the match handler runs waits for it (up to 17 instruction cycles more)
; Numbers after ';' in the handler are instruction cycles (4 clocks each,
; datasheet instruction set summary); banksel is one movlb on this core.
; Registers: DS40001441 interrupt-on-change (IOCAP, IOCAN, IOCAF), Timer2
; (T2CON, TMR2, PR2) and interrupt (INTCON, PIE1, PIR1) chapters.

; Common RAM (0x70-0x7F) is reachable from every bank.
    cblock  0x70
        phase                       ; bit 0 set while the pulse is on
    endc

    org     0x0000
    goto    start

    org     0x0004
; W, STATUS, BSR, FSR and PCLATH are saved and restored by the core.
isr:
    banksel IOCAF                   ; 1
    btfss   IOCAF, IOCAF1            ; 2 with the edge flag set (skips)
    goto    isr_match
    ; Restart rule: an edge always starts the delay again from 0.
    ; Timer2 is stopped for the clear: TMR2 is only written while stopped.
    banksel T2CON                   ; 1
    bcf     T2CON, TMR2ON           ; 1
    clrf    TMR2                    ; 1: count from 0 (clears the prescaler)
    bsf     T2CON, TMR2ON           ; 1: cycle 7, Timer2 runs
    movlw   62
    movwf   PR2                     ; the delay's match again
    bcf     PIR1, TMR2IF
    banksel LATA
    movlw   0x00
    movwf   LATA                    ; a running pulse is cut short
    bcf     phase, 0
    banksel IOCAF
    bcf     IOCAF, IOCAF1            ; edge seen
    retfie

; Timer2 matched PR2 (the only other interrupt enabled): TMR2 is back at 0.
; Both paths write LATA at cycle 10, so the pulse keeps its counted width.
isr_match:
    banksel LATA                    ; 1 (after 1 + 1 + 2 above)
    btfsc   phase, 0                ; 2 in the delay (skips), 1 in the pulse
    goto    isr_off                 ; 2
    movlw   0x04                 ; 1
    nop                             ; 1
    movwf   LATA                    ; 1: cycle 10, pulse on
    banksel PR2                     ; 1
    movlw   15                  ; 1
    movwf   PR2                     ; 1: cycle 13, the pulse's match
    bcf     PIR1, TMR2IF
    bsf     phase, 0
    retfie
isr_off:
    movlw   0x00                 ; 1
    movwf   LATA                    ; 1: cycle 10, pulse off
    banksel T2CON
    bcf     T2CON, TMR2ON           ; stop until the next edge
    clrf    TMR2
    movlw   62
    movwf   PR2                     ; the delay's match
    bcf     PIR1, TMR2IF
    bcf     phase, 0
    retfie

start:
    clrf    phase
    ; all of PORTA digital
    banksel ANSELA
    movlw   0x00
    movwf   ANSELA
    ; output latch at the pulse's off level
    banksel LATA
    movlw   0x00
    movwf   LATA
    ; RA2 output (GPIO), RA1 and the rest inputs
    banksel TRISA
    movlw   0x3B
    movwf   TRISA
    ; nWPUEN = 0: weak pull-ups as WPUA selects
    banksel OPTION_REG
    movlw   0x7F
    movwf   OPTION_REG
    ; weak pull-up on RA1 only
    banksel WPUA
    movlw   0x02
    movwf   WPUA
    ; TMR2ON = 0 (stopped), T2CKPS = 3 (prescale 1:64)
    banksel T2CON
    movlw   0x03
    movwf   T2CON
    ; count from 0 at the first edge
    banksel TMR2
    movlw   0x00
    movwf   TMR2
    ; PR2 = delayCounts - 1: the first match ends the delay
    banksel PR2
    movlw   62
    movwf   PR2
    ; no stale match
    banksel PIR1
    bcf     PIR1, TMR2IF
    ; TMR2IE = 1
    banksel PIE1
    movlw   0x02
    movwf   PIE1
    ; rising edges on RA1: off
    banksel IOCAP
    movlw   0x00
    movwf   IOCAP
    ; falling edges on RA1: on
    banksel IOCAN
    movlw   0x02
    movwf   IOCAN
    ; no stale edge
    banksel IOCAF
    movlw   0x00
    movwf   IOCAF
    ; GIE = 1, PEIE = 1, IOCIE = 1
    banksel INTCON
    movlw   0xC8
    movwf   INTCON

; Everything else happens in the handlers.
idle:
    goto    idle

    end
