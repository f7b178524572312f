; Warehouse robots (a plumbline scenario, invented for this project).
; Robots drive on a grid of floor cells between storage racks; a move to a neighbouring cell
; costs 1 (battery and wear), and two robots never share a cell. Picking a parcel up and
; putting it down cost nothing, and neither does an overhead conveyor that carries parcels
; from cell to cell along its track towards the packing station.
(define (domain warehouse)
  (:requirements :strips :typing :negative-preconditions :action-costs)
  (:types cell robot parcel - object)
  (:predicates
    (adjacent ?a - cell ?b - cell)
    (belt ?from - cell ?to - cell)
    (robot-at ?r - robot ?c - cell)
    (occupied ?c - cell)
    (parcel-at ?p - parcel ?c - cell)
    (carrying ?r - robot ?p - parcel)
    (loaded ?r - robot))
  (:functions (total-cost) - number)

  ; a robot drives to a free neighbouring cell
  (:action move
    :parameters (?r - robot ?from - cell ?to - cell)
    :precondition (and (robot-at ?r ?from) (adjacent ?from ?to) (not (occupied ?to)))
    :effect (and (not (robot-at ?r ?from)) (not (occupied ?from))
                 (robot-at ?r ?to) (occupied ?to)
                 (increase (total-cost) 1)))

  ; an empty robot picks up a parcel lying on its cell (free)
  (:action pick
    :parameters (?r - robot ?p - parcel ?c - cell)
    :precondition (and (robot-at ?r ?c) (parcel-at ?p ?c) (not (loaded ?r)))
    :effect (and (not (parcel-at ?p ?c)) (carrying ?r ?p) (loaded ?r)))

  ; a robot puts its parcel down on its cell (free)
  (:action drop
    :parameters (?r - robot ?p - parcel ?c - cell)
    :precondition (and (robot-at ?r ?c) (carrying ?r ?p))
    :effect (and (not (carrying ?r ?p)) (parcel-at ?p ?c) (not (loaded ?r))))

  ; the conveyor carries a parcel one cell along its track (free)
  (:action convey
    :parameters (?p - parcel ?from - cell ?to - cell)
    :precondition (and (parcel-at ?p ?from) (belt ?from ?to))
    :effect (and (not (parcel-at ?p ?from)) (parcel-at ?p ?to))))
