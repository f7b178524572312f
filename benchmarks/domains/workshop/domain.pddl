; Workshop scheduling (a plumbline scenario, invented for this project).
; Orders need operations (drilling, milling, ...). An operation runs on a machine fitted with
; a tool that performs it; tools live in one shared rack. Fitting a tool on a bare machine
; costs that machine's set-up time; a direct swap from one tool to another costs the
; machine's swap time, which is cheaper than a fresh fit on machines with a quick-change
; chuck and dearer on the others (the on-call setter must come). Stripping a machine back
; to bare and signing an order off are bookkeeping done by the operator and cost nothing.
(define (domain workshop)
  (:requirements :strips :typing :negative-preconditions :universal-preconditions
                 :conditional-effects :action-costs)
  (:types job machine tool operation - object)
  (:predicates
    (needs ?j - job ?o - operation)
    (performs ?t - tool ?o - operation)
    (accepts ?m - machine ?t - tool)
    (fitted ?m - machine ?t - tool)
    (in-rack ?t - tool)
    (bare ?m - machine)
    (done ?j - job ?o - operation)
    (signed-off ?j - job))
  (:functions
    (fit-cost ?m - machine) - number
    (swap-cost ?m - machine) - number
    (run-cost ?m - machine) - number
    (total-cost) - number)

  ; the setter mounts a tool from the rack on a bare machine
  (:action fit
    :parameters (?m - machine ?t - tool)
    :precondition (and (bare ?m) (in-rack ?t) (accepts ?m ?t))
    :effect (and (not (bare ?m)) (not (in-rack ?t)) (fitted ?m ?t)
                 (increase (total-cost) (fit-cost ?m))))

  ; the setter exchanges the fitted tool for another one straight away
  (:action swap
    :parameters (?m - machine ?old - tool ?new - tool)
    :precondition (and (fitted ?m ?old) (in-rack ?new) (accepts ?m ?new))
    :effect (and (not (fitted ?m ?old)) (in-rack ?old)
                 (fitted ?m ?new) (not (in-rack ?new))
                 (increase (total-cost) (swap-cost ?m))))

  ; the operator takes whatever tool is fitted back to the rack (free)
  (:action strip
    :parameters (?m - machine)
    :precondition (not (bare ?m))
    :effect (and (bare ?m)
                 (forall (?t - tool)
                   (when (fitted ?m ?t) (and (not (fitted ?m ?t)) (in-rack ?t))))))

  ; one operation of an order runs on a machine fitted with a suitable tool
  (:action run
    :parameters (?j - job ?o - operation ?m - machine ?t - tool)
    :precondition (and (needs ?j ?o) (not (done ?j ?o)) (fitted ?m ?t) (performs ?t ?o))
    :effect (and (done ?j ?o) (increase (total-cost) (run-cost ?m))))

  ; paperwork: an order whose operations are all done is signed off (free)
  (:action sign-off
    :parameters (?j - job)
    :precondition (and (not (signed-off ?j))
                       (forall (?o - operation) (imply (needs ?j ?o) (done ?j ?o))))
    :effect (signed-off ?j)))
