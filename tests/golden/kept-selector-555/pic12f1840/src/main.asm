; PIC12F1840 replacement timing stage: the image source (gpasm, gputils)
; Retrofit: Ostberg pump house lead-lag timer | site: Ostberg Valley Water Board, station 4 | asset: OVWB-PH4-T2
; Revision r1, engine 1.0.0; target 6 (pic12f1840)
; TIMER2, mode pwm, clock 16.00000 MHz, output RA2 (CCP1, pin 5)
; Period 1.456000 ms (+274.801 ppm), high 764.0000 us (+2098.636 ppm)
; Register values: PIC12(L)F1840 datasheet (DS40001441), oscillator, Timer2 and
; CCP chapters. The same start-up steps, in the same order, are in src/main.c.

    list    p=12f1840
    radix   dec
    #include <p12f1840.inc>
    errorlevel -302                 ; every access below is preceded by BANKSEL

; Configuration words (datasheet Register 4-1 CONFIG1, 4-2 CONFIG2).
; INTOSC: internal oscillator, RA4 and RA5 free. Watchdog off (nothing here services it), power-up timer on,
; MCLR as reset (10 kOhm pull-up on pin 4), brown-out reset on at the high trip
; point, fail-safe clock monitor off (a failed clock stops the output rather
; than running it at the wrong rate), high-voltage programming only.
    __CONFIG _CONFIG1, _FOSC_INTOSC & _WDTE_OFF & _PWRTE_ON & _MCLRE_ON & _CP_OFF & _CPD_OFF & _BOREN_ON & _CLKOUTEN_OFF & _IESO_OFF & _FCMEN_OFF
    __CONFIG _CONFIG2, _WRT_OFF & _PLLEN_OFF & _STVREN_ON & _BORV_HI & _LVP_OFF

    org     0x0000
    goto    start

    org     0x0004
    retfie                          ; no interrupts are enabled

start:
    ; IRCF = 1111: 16 MHz HFINTOSC, SCS = 00 (clock from FOSC = INTOSC)
    banksel OSCCON
    movlw   0x78
    movwf   OSCCON
    ; HFIOFR: oscillator ready
    banksel OSCSTAT
wait_1:
    btfss   OSCSTAT, HFIOFR
    goto    wait_1
    ; all of PORTA digital
    banksel ANSELA
    movlw   0x00
    movwf   ANSELA
    ; output latch low before the driver is on
    banksel LATA
    movlw   0x00
    movwf   LATA
    ; PWM setup 1: RA2 driver off (TRISA2 = 1)
    banksel TRISA
    movlw   0x3F
    movwf   TRISA
    ; CCP1SEL = 0: CCP1 on RA2
    banksel APFCON
    movlw   0x00
    movwf   APFCON
    ; PR2 = periodCounts - 1; period = (PR2+1)*4*Tosc*prescale
    banksel PR2
    movlw   90
    movwf   PR2
    ; PWM setup 3: DC1B = 3, CCP1M = 1100 (PWM, active high)
    banksel CCP1CON
    movlw   0x3C
    movwf   CCP1CON
    ; PWM setup 4: CCPR1L:DC1B = 191 (highCounts*4); pulse = 191*Tosc*prescale
    banksel CCPR1L
    movlw   47
    movwf   CCPR1L
    ; PWM setup 5: clear TMR2IF before Timer2 starts
    banksel PIR1
    bcf     PIR1, TMR2IF
    ; TMR2ON = 1, T2CKPS = 3 (prescale 1:64), postscale 1:1
    banksel T2CON
    movlw   0x07
    movwf   T2CON
    ; PWM setup 6: Timer2 has overflowed once
    banksel PIR1
wait_11:
    btfss   PIR1, TMR2IF
    goto    wait_11
    ; PWM setup 6: RA2 driver on (TRISA2 = 0)
    banksel TRISA
    movlw   0x3B
    movwf   TRISA

    goto    sel_run                 ; the kept selector switch (selector_control.inc)
    #include "selector_control.inc"
idle:
    goto    idle

    end
